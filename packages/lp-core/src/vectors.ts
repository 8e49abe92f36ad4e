/** Dense vector kernels shared by the interior-point method and the log-barrier method. */

/** aᵀb */
export function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}
