// The durand-kerner package ships no types: coefficients in increasing degree, real and imaginary parts.
declare module "durand-kerner" {
  export default function findRoots(
    realCoefficients: ArrayLike<number>,
    imagCoefficients?: ArrayLike<number> | null,
    iterations?: number,
    tolerance?: number,
    initialReal?: number[],
    initialImag?: number[],
  ): [number[], number[]];
}
