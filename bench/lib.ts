/** Median wall time in ms of `runs` calls of fn (after one warm-up call). */
export async function medianMs(fn: () => unknown | Promise<unknown>, runs = 7): Promise<number> {
  await fn();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await fn();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}
