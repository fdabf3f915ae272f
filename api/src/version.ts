import { readFileSync } from 'node:fs';

/** The product's version, from package.json. */
export const PRODUCT_VERSION: string = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')).version;
