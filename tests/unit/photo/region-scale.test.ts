/**
 * A region drawn on the preview, scaled to the original's pixels, stays inside the original: the server
 * refuses a rectangle reaching outside the photo (issue 14), so the client must never send one.
 */
import { expect, it } from 'vitest';
import { scaleSpan } from '../../../src/features/photos/lib/region';

it('keeps a region at the far edge inside the original (rounding start and length apart could pass it)', () => {
  // a 100 px preview of a 301 px original (scale 3.01): the right half, 50..100, is 150.5 → 151 and 150.5 → 151
  const [x, w] = scaleSpan(50, 50, 3.01, 301);
  expect(x + w).toBeLessThanOrEqual(301);
  expect([x, w]).toEqual([151, 150]);
});

it('keeps every region of every preview size inside the original, at least 1 px', () => {
  for (const size of [301, 302, 997, 4000, 6001]) {
    const preview = 100;
    const scale = size / preview;
    for (let start = 0; start < preview; start += 7) {
      for (let len = 1; start + len <= preview; len += 11) {
        const [s, l] = scaleSpan(start, len, scale, size);
        expect(s).toBeGreaterThanOrEqual(0);
        expect(l).toBeGreaterThanOrEqual(1);
        expect(s + l).toBeLessThanOrEqual(size);
      }
    }
  }
});
