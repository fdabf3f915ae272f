// The tests' way to the Debian packages they need; the implementation lives with the local stack.
export { ensureDebianPackage, debianPythonWithScipy } from '../../api/src/local/debian-package.ts';
