/** Social cards: size budget, dimensions, and the content-hash cache. */
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Resvg } from '@resvg/resvg-js';
import { afterAll, describe, expect, it } from 'vitest';
import { CARD_HEIGHT, CARD_WIDTH, cardSvg, renderCard, renderCardCached, type CardInput } from '../site/gloaming/card.ts';

const input: CardInput = {
  centre: 'Quayside Lantern Science Centre',
  accent: '#f3b962',
  title: 'A very long bulletin title about a comet low in the west-southwest after sunset',
  siteName: 'Northern Fjord Outpost',
  weekLabel: '28 Dec 2026 – 3 Jan 2027',
  horizon: [
    { azimuthDeg: 0, altitudeDeg: 3 },
    { azimuthDeg: 120, altitudeDeg: 12 },
    { azimuthDeg: 280, altitudeDeg: 4 },
  ],
  caution: 'Eye-safety notice inside',
};
const dir = mkdtempSync(join(tmpdir(), 'gloaming-card-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('social card', () => {
  it('is a 1200×630 PNG under 80 KB that decodes', async () => {
    const png = await renderCard(input);
    expect(png.length).toBeLessThan(80 * 1024);
    // Decoded by resvg's own PNG reader via an <image>: independent of how we wrote it.
    const probe = new Resvg(
      `<svg xmlns="http://www.w3.org/2000/svg" width="${CARD_WIDTH}" height="${CARD_HEIGHT}"><image href="data:image/png;base64,${Buffer.from(png).toString('base64')}" width="${CARD_WIDTH}" height="${CARD_HEIGHT}"/></svg>`,
    ).render();
    // Top-left pixel: the card's background colour #0c1019, fully opaque.
    expect([...probe.pixels.subarray(0, 4)]).toEqual([0x0c, 0x10, 0x19, 255]);
    expect(Buffer.from(png).readUInt32BE(16)).toBe(CARD_WIDTH);
    expect(Buffer.from(png).readUInt32BE(20)).toBe(CARD_HEIGHT);
  });

  it("holds exactly the pixels resvg drew, fully opaque, as resvg's own PNG writer would", async () => {
    // Both PNGs decoded by resvg's PNG reader (an <image> at its own size): ours (unfiltered rows,
    // zlib level 1) must carry the same picture as resvg's asPng of the same render.
    const decode = (png: Uint8Array): Uint8Array =>
      new Resvg(
        `<svg xmlns="http://www.w3.org/2000/svg" width="${CARD_WIDTH}" height="${CARD_HEIGHT}"><image href="data:image/png;base64,${Buffer.from(png).toString('base64')}" width="${CARD_WIDTH}" height="${CARD_HEIGHT}"/></svg>`,
      ).render().pixels;
    const reference = new Resvg(await cardSvg(input), { fitTo: { mode: 'width', value: CARD_WIDTH }, font: { loadSystemFonts: false } }).render().asPng();
    const ours = decode(await renderCard(input));
    expect(Buffer.from(ours).equals(Buffer.from(decode(reference)))).toBe(true);
    for (let i = 3; i < ours.length; i += 4) if (ours[i] !== 255) throw new Error(`pixel ${(i - 3) / 4} is not opaque`);
  });

  it("draws the site and week line in the centre's accent colour", async () => {
    const pixels = async (accent: string): Promise<Uint8Array> => {
      const png = await renderCard({ ...input, accent });
      return new Resvg(
        `<svg xmlns="http://www.w3.org/2000/svg" width="${CARD_WIDTH}" height="${CARD_HEIGHT}"><image href="data:image/png;base64,${Buffer.from(png).toString('base64')}" width="${CARD_WIDTH}" height="${CARD_HEIGHT}"/></svg>`,
      ).render().pixels;
    };
    const count = (p: Uint8Array, [r, g, b]: number[]): number => {
      let n = 0;
      for (let i = 0; i < p.length; i += 4) if (p[i] === r && p[i + 1] === g && p[i + 2] === b) n++;
      return n;
    };
    // Solid text strokes of a 38 px bold line cover thousands of pixels in exactly the accent colour.
    expect(count(await pixels('#3fd0a0'), [0x3f, 0xd0, 0xa0])).toBeGreaterThan(1000);
    expect(count(await pixels('#f3b962'), [0x3f, 0xd0, 0xa0])).toBe(0);
  });

  it('is served from the cache on a hit and recomputed when an input or the code changes', async () => {
    const first = await renderCardCached(input, { cacheDir: dir, codeDigest: 'code-1' });
    const files = readdirSync(join(dir, 'cards'));
    expect(files).toHaveLength(1);
    // Replace the cached bytes: a hit must return them without rendering.
    writeFileSync(join(dir, 'cards', files[0]!), Buffer.from('cached'));
    expect(Buffer.from(await renderCardCached(input, { cacheDir: dir, codeDigest: 'code-1' })).toString()).toBe('cached');
    const changedCode = await renderCardCached(input, { cacheDir: dir, codeDigest: 'code-2' });
    expect(Buffer.from(changedCode)).toEqual(Buffer.from(first));
    await renderCardCached({ ...input, weekLabel: '4 – 10 Jan 2027' }, { cacheDir: dir, codeDigest: 'code-1' });
    expect(readdirSync(join(dir, 'cards'))).toHaveLength(3);
  });
});
