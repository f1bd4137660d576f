/** All draws of all chains in one array, chain after chain. */
export function concatenateChains(chains: readonly Float64Array[]): Float64Array {
  let total = 0;
  for (const chain of chains) total += chain.length;
  const pooled = new Float64Array(total);
  let offset = 0;
  for (const chain of chains) {
    pooled.set(chain, offset);
    offset += chain.length;
  }
  return pooled;
}
