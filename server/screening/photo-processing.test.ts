import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { IMAGE_CONCURRENCY, imageWorkStats, processPhoto } from './photo-processing';

const photo = (i: number) =>
  sharp({ create: { width: 1200, height: 1600, channels: 3, background: { r: 40 + i * 20, g: 90, b: 140 } } })
    .jpeg({ quality: 85 })
    .toBuffer();

describe('photo processing', () => {
  it(`works on at most ${IMAGE_CONCURRENCY} images at once however many arrive, and finishes them all`, async () => {
    const inputs = await Promise.all(Array.from({ length: 8 }, (_, i) => photo(i)));
    const results = await Promise.all(inputs.map((input) => processPhoto(input)));
    expect(results.map((r) => [r.width, r.height])).toEqual(Array(8).fill([1200, 1600]));
    expect(results.every((r) => r.thumb.length > 0 && r.thumb.length < r.full.length)).toBe(true);
    const stats = imageWorkStats();
    expect(stats.maxWorking).toBe(IMAGE_CONCURRENCY); // they did overlap: the bound was what held them
    expect(stats).toMatchObject({ working: 0, waiting: 0 });
  });

  it('a refused image does not hold its turn: the next one is worked on', async () => {
    await expect(processPhoto(Buffer.from('not a photo at all'))).rejects.toMatchObject({ status: 415 });
    expect((await processPhoto(await photo(1))).width).toBe(1200);
    expect(imageWorkStats()).toMatchObject({ working: 0, waiting: 0 });
  });
});
