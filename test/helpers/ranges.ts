/** Logarithmically spaced values 10^from … 10^to, `step` decades apart (test grids over densities). */
export function decades(from: number, to: number, step = 0.25): number[] {
  const out: number[] = [];
  for (let u = from; u <= to + 1e-9; u += step) out.push(Math.pow(10, u));
  return out;
}
