/**
 * In-place iterative radix-2 fast Fourier transform (Cooley & Tukey 1965),
 * used to convolve a discretised density with itself n times (the
 * distribution of a sum of n truncated normal values in equivalency.ts).
 */

/** Forward (sign -1) or inverse (sign +1, unscaled) transform of re + i·im, length a power of two. */
export function fftInPlace(re: Float64Array, im: Float64Array, sign: 1 | -1): void {
  const size = re.length;
  for (let i = 1, j = 0; i < size; i++) {
    let bit = size >> 1;
    for (; j & bit; bit >>= 1) j ^= bit;
    j ^= bit;
    if (i < j) {
      [re[i], re[j]] = [re[j], re[i]];
      [im[i], im[j]] = [im[j], im[i]];
    }
  }
  for (let length = 2; length <= size; length <<= 1) {
    const angle = (sign * 2 * Math.PI) / length;
    const wRe = Math.cos(angle);
    const wIm = Math.sin(angle);
    for (let start = 0; start < size; start += length) {
      let uRe = 1;
      let uIm = 0;
      for (let k = 0; k < length / 2; k++) {
        const a = start + k;
        const b = a + length / 2;
        const tRe = re[b] * uRe - im[b] * uIm;
        const tIm = re[b] * uIm + im[b] * uRe;
        re[b] = re[a] - tRe;
        im[b] = im[a] - tIm;
        re[a] += tRe;
        im[a] += tIm;
        const nextRe = uRe * wRe - uIm * wIm;
        uIm = uRe * wIm + uIm * wRe;
        uRe = nextRe;
      }
    }
  }
}

/** The n-fold convolution of a probability vector with itself (length n (m - 1) + 1). */
export function convolutionPower(probabilities: Float64Array, n: number): Float64Array {
  const outLength = n * (probabilities.length - 1) + 1;
  let size = 1;
  while (size < outLength) size <<= 1;
  const re = new Float64Array(size);
  const im = new Float64Array(size);
  re.set(probabilities);
  fftInPlace(re, im, -1);
  for (let i = 0; i < size; i++) {
    // (re + i im)^n through the polar form.
    const modulus = Math.pow(Math.hypot(re[i], im[i]), n);
    const phase = n * Math.atan2(im[i], re[i]);
    re[i] = modulus * Math.cos(phase);
    im[i] = modulus * Math.sin(phase);
  }
  fftInPlace(re, im, 1);
  const out = new Float64Array(outLength);
  for (let i = 0; i < outLength; i++) out[i] = re[i] / size;
  return out;
}
