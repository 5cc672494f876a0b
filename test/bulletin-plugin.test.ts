/**
 * The placeholder plugin in a plain unified pipeline, outside gloaming's own renderer: problems
 * are messages on the file at the directive's node (the unified way), the plugin keeps no state
 * between documents, and charts without a chart output are kept in memory.
 */
import * as Astronomy from 'astronomy-engine';
import rehypeStringify from 'rehype-stringify';
import remarkDirective from 'remark-directive';
import remarkParse from 'remark-parse';
import remarkRehype from 'remark-rehype';
import { unified } from 'unified';
import { VFile } from 'vfile';
import { describe, expect, it } from 'vitest';
import { BodyRegistry } from '../lib/core/body.ts';
import { GloamingError } from '../lib/core/errors.ts';
import { isoWeekOf } from '../lib/core/time.ts';
import { loadSites } from '../lib/models/content.ts';
import { ChartCache } from '../lib/outputs/chart/index.ts';
import { WeekCache, errorsOnFile, remarkPlaceholders, warningsOnFile, type PlaceholderScope } from '../lib/outputs/bulletin/index.ts';

const sites = loadSites('content/sites');
const weeks = new WeekCache();

function process(markdown: string, scope: Omit<PlaceholderScope, 'bodies' | 'cache'>): VFile {
  const file = new VFile({ value: markdown, path: 'notes/plain.md' });
  const processor = unified()
    .use(remarkParse)
    .use(remarkDirective)
    .use(remarkPlaceholders, { scope: () => ({ ...scope, bodies: new BodyRegistry(), cache: weeks }) })
    .use(remarkRehype)
    .use(rehypeStringify);
  file.value = String(processor.processSync(file));
  return file;
}

describe('remarkPlaceholders in a plain unified pipeline', () => {
  it('leaves a value slot with no value as a warning message at the directive (polar night: no sunset)', () => {
    const site = sites.get('northern-outpost')!;
    const week = isoWeekOf('2026-12-21');
    // Outside reference: astronomy-engine's own sunset search finds none for that evening (the
    // Sun stays more than 0.833° below the horizon at 68.55° N around the December solstice).
    const observer = new Astronomy.Observer(site.latitudeDeg, site.longitudeDeg, 0);
    const start = Astronomy.MakeTime(new Date('2026-12-21T09:00:00Z'));
    expect(Astronomy.SearchRiseSet(Astronomy.Body.Sun, observer, -1, start, 1)).toBeNull();
    const file = process('# Tonight\n\nThe Sun sets at :sunset.\n', { site, week });
    const [warning, ...rest] = file.messages;
    expect(rest).toHaveLength(0);
    // The directive ':sunset' starts on line 3, column 17 of the text above.
    expect({ line: warning!.line, column: warning!.column, ruleId: warning!.ruleId, source: warning!.source, fatal: warning!.fatal }).toEqual({ line: 3, column: 17, ruleId: 'fallback', source: 'gloaming', fatal: false });
    const [problem] = warningsOnFile(file, { site: site.id, week: week.id });
    expect(problem).toMatchObject({ kind: 'fallback', severity: 'warning', place: { file: 'notes/plain.md', line: 3, column: 17 }, site: 'northern-outpost' });
    expect(problem!.message).toMatch(/^':sunset' has no value on Monday 21 December \(the Sun stays below the horizon all day\)/);
  });

  it('reports every template error as a fatal message at its node, then throws them placed at file:line:column', () => {
    const site = sites.get('harbour-roof')!;
    const file = new VFile({ value: 'Line one.\n\nSunset :sunsett, rise :rise{body=jupitr}.\n', path: 'notes/bad.md' });
    const processor = unified().use(remarkParse).use(remarkDirective).use(remarkPlaceholders, { scope: () => ({ site, week: isoWeekOf('2026-12-04'), bodies: new BodyRegistry(), cache: weeks }) });
    expect(() => processor.runSync(processor.parse(file), file)).toThrow(GloamingError);
    const fatal = file.messages.filter((m) => m.fatal);
    // ':sunsett' starts at column 8 of line 3 and ':rise{…}' at column 23.
    expect(fatal.map((m) => [m.line, m.column, m.ruleId])).toEqual([
      [3, 8, 'unknown-placeholder'],
      [3, 23, 'unknown-body'],
    ]);
    // The second place also names the attribute.
    expect(errorsOnFile(file).map((e) => e.message.split(':').slice(0, 3).join(':'))).toEqual(['notes/bad.md:3:8', "notes/bad.md:3:23 field 'body'"]);
  });

  it('keeps charts in memory when no chart output is given (nothing is written), and draws each once per cache', () => {
    const cache = new ChartCache();
    expect(cache.dir).toBeNull();
    const site = sites.get('harbour-roof')!;
    const request = { kind: 'sky' as const, site, time: new Date('2026-12-07T19:00:00Z') };
    const first = cache.get(request);
    const again = cache.get(request);
    expect([first.hit, again.hit, again.svg === first.svg]).toEqual([false, true, true]);
  });
});
