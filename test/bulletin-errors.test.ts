/**
 * Error corpus (issue #6): every malformed input yields a GloamingError with its permanent code and
 * the exact positioned message — file:line:column, what is wrong, what was expected, a suggestion.
 * Inputs are in bulletin-errors.cases.ts; each place below was checked by hand against its input
 * (the default front matter is lines 1–5, the body starts on line 6).
 */
import { describe, expect, it } from 'vitest';
import { BodyRegistry } from '../lib/core/body.ts';
import { loadSites } from '../lib/models/content.ts';
import { GloamingError } from '../lib/core/errors.ts';
import { isoWeekOf } from '../lib/core/time.ts';
import { parseBulletin, pagesFor, renderBulletinSync } from '../lib/outputs/bulletin/index.ts';
import { CASE_INPUTS } from './bulletin-errors.cases.ts';

const sites = loadSites('content/sites');

const EXPECTED: Record<string, [string, string]> = {
  "unknown placeholder with suggestion": ["unknown-placeholder", "content/bulletins/bad.md:6:5: unknown placeholder ':sunsett'; expected a placeholder listed in lib/outputs/bulletin/PLACEHOLDERS.md — did you mean 'sunset'?"],
  "unknown placeholder without suggestion": ["unknown-placeholder", "content/bulletins/bad.md:6:3: unknown placeholder ':frobnicate'; expected a placeholder listed in lib/outputs/bulletin/PLACEHOLDERS.md — write \\: to keep a literal colon before a word"],
  "unknown attribute": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'nigth': unknown attribute 'nigth' on ':rise'; expected one of body, night, clock, precision — did you mean 'night'?"],
  "unknown body": ["unknown-body", "content/bulletins/bad.md:6:7 field 'body': unknown body 'jupyter'; expected one of sun, moon, mercury, venus, mars, jupiter, saturn, uranus, neptune — did you mean 'jupiter'?"],
  "missing body": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'body': ':rise' needs the attribute 'body' (or sit inside :::every-target); expected the body or object — e.g. :rise{body=jupiter}"],
  "empty body": ["invalid-placeholder", "content/bulletins/bad.md:6:1: the attributes of ':set' cannot be read; expected name=value pairs separated by spaces inside { }, e.g. :set{body=moon night=3} — check for a missing } or an unbalanced quote"],
  "night name misspelt": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'night': cannot read the night 'funday' (got 'funday'); expected mon…sun, 1–7 or a YYYY-MM-DD date in the week"],
  "night number out of range": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'night': night 8 is outside the week (got '8'); expected mon…sun, 1–7 or a YYYY-MM-DD date in the week — nights are numbered 1 (Monday) to 7 (Sunday)"],
  "night date outside the week": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'night': the date 2027-01-11 is not in this page's week (got '2027-01-11'); expected mon…sun, 1–7 or a YYYY-MM-DD date in the week — this week runs from 2026-11-30 to 2026-12-06"],
  "clock out of range": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'clock': cannot read the clock '13' (got '13'); expected 12 or 24"],
  "time precision word": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'precision': cannot read the precision 'hour' (got 'hour'); expected minute or second"],
  "digits out of range": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'precision': attribute 'precision' is out of range (got '5'); expected an integer 0–2"],
  "digits not a number": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'precision': attribute 'precision' must be a whole number (got 'x'); expected an integer 0–2"],
  "twilight kind unknown": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'kind': 'nautcal' is not a value of 'kind' (got 'nautcal'); expected civil | nautical | astronomical — did you mean 'nautical'?"],
  "moment unknown": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'at': cannot read the moment 'noon' (got 'noon'); expected best | rise | transit | set | HH:MM"],
  "moment impossible clock time": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'at': '25:00' is not a clock time (got '25:00'); expected best | transit | HH:MM"],
  "moment missing": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'at': ':altitude' needs the attribute 'at'; expected the moment (a clock time before 12:00 is the next morning) — e.g. :altitude{body=jupiter at=21:00}"],
  "style unknown": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'style': 'compass' is not a value of 'style' (got 'compass'); expected word | short | degrees"],
  "block placeholder written inline": ["invalid-placeholder", "content/bulletins/bad.md:6:8: ':moon-and-twilight' is a block placeholder — write ::moon-and-twilight on a line of its own"],
  "inline placeholder written as a block": ["invalid-placeholder", "content/bulletins/bad.md:6:1: '::sunset' is an inline placeholder — write :sunset inside a sentence"],
  "placeholder written as a container": ["invalid-placeholder", "content/bulletins/bad.md:6:1: ':::targets' is written as a container, which no placeholder is — write ::targets on a line of its own"],
  "placeholder with a label": ["invalid-placeholder", "content/bulletins/bad.md:6:4: ':sunset' takes no [label] — attributes go in braces, e.g. :sunset{night=sat}"],
  "chart view unknown": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'view': 'side' is not a value of 'view' (got 'side'); expected horizon | sky"],
  "event type unknown": ["invalid-placeholder", "content/bulletins/bad.md:8:4 field 'type': 'full-mon' is not a value of 'type' (got 'full-mon'); expected new-moon | first-quarter | full-moon | last-quarter | perigee | apogee | equinox | solstice | opposition | conjunction | greatest-elongation | greatest-brilliancy | stationary | close-approach | meteor-shower-peak | lunar-eclipse | solar-eclipse | perihelion | closest-approach-to-earth | peak-brightness | satellite-pass | variable-minimum | occultation — did you mean 'full-moon'?"],
  "unclosed attribute braces": ["invalid-placeholder", "content/bulletins/bad.md:6:7: the attributes of ':rise' cannot be read; expected name=value pairs separated by spaces inside { }, e.g. :rise{body=jupiter} — check for a missing } or an unbalanced quote"],
  "unbalanced quote": ["invalid-placeholder", "content/bulletins/bad.md:6:7: the attributes of ':rise' cannot be read; expected name=value pairs separated by spaces inside { }, e.g. :rise{body=jupiter} — check for a missing } or an unbalanced quote"],
  "block placeholder inside a paragraph": ["invalid-placeholder", "content/bulletins/bad.md:6:15: '::moon-and-twilight' must stand on a line of its own — put it on its own line, with blank lines around it"],
  "attribute on a placeholder without attributes": ["invalid-placeholder", "content/bulletins/bad.md:6:1 field 'night': unknown attribute 'night' on ':week'; expected no attributes"],
  "error on a later line and column": ["invalid-placeholder", "content/bulletins/bad.md:9:6 field 'night': night 0 is outside the week (got '0'); expected mon…sun, 1–7 or a YYYY-MM-DD date in the week — nights are numbered 1 (Monday) to 7 (Sunday)"],
  "unknown body in front matter": ["unknown-body", "content/bulletins/bad.md:5:17 field 'bodies.1': unknown body 'jupyter'; expected one of sun, moon, mercury, venus, mars, jupiter, saturn, uranus, neptune — did you mean 'jupiter'?"],
  "no front matter": ["missing-field", "content/bulletins/bad.md:1:1: a bulletin template starts with front matter; expected a first line '---', the YAML fields, then another '---' line"],
  "front matter not closed": ["invalid-yaml", "content/bulletins/bad.md:4:1: the front matter is not closed; expected a line '---' after the front matter fields"],
  "invalid YAML": ["invalid-yaml", "content/bulletins/bad.md:3:1: YAML syntax error: Flow sequence in block collection must be sufficiently indented and end with a ]; expected valid YAML (check indentation, colons and quotes)"],
  "missing title": ["missing-field", "content/bulletins/bad.md:2:1 field 'title': missing field 'title'; expected the bulletin title as text"],
  "unknown field with suggestion": ["unknown-field", "content/bulletins/bad.md:4:10 field 'shedule': unknown front matter field 'shedule'; expected one of title, description, sites, schedule, date, bodies, eclipse — did you mean 'schedule'?"],
  "sites not a list": ["invalid-value", "content/bulletins/bad.md:3:8 field 'sites': sites must be a list of ids (got 5); expected 'all' or a list of site ids such as [harbour-roof]"],
  "sites entry not a slug": ["invalid-value", "content/bulletins/bad.md:3:23 field 'sites.1': sites entries are lower-case ids (got 'Southern Station'); expected letters a–z, digits and hyphens, e.g. 'jupiter'"],
  "site listed twice": ["invalid-value", "content/bulletins/bad.md:3:23 field 'sites.1': 'harbour-roof' is listed twice in sites (got 'harbour-roof'); expected each id once"],
  "both date and schedule": ["invalid-value", "content/bulletins/bad.md:5:11 field 'schedule': a bulletin has either a date (one-off) or a schedule (standing weekly), not both (got {\"every\":\"week\"}); expected only one of date or schedule — remove one of them"],
  "neither date nor schedule": ["missing-field", "content/bulletins/bad.md:2:1 field 'schedule': a bulletin needs either a date or a schedule; expected date: YYYY-MM-DD for a one-off bulletin, or schedule: { every: week } for a standing weekly one"],
  "impossible date": ["invalid-date", "content/bulletins/bad.md:4:7 field 'date': cannot read the date '2026-02-30'; expected a calendar date written YYYY-MM-DD, e.g. 2026-12-04"],
  "schedule past negative": ["invalid-value", "content/bulletins/bad.md:6:9 field 'schedule.past': schedule.past must be a whole number of weeks (got -1); expected an integer from 0 to 104"],
  "schedule every month": ["invalid-value", "content/bulletins/bad.md:4:20 field 'schedule.every': only weekly schedules are supported (got 'month'); expected 'week'"],
  "schedule unknown field": ["unknown-field", "content/bulletins/bad.md:4:33 field 'schedule.futur': unknown front matter field 'schedule.futur'; expected one of every, past, future — did you mean 'future'?"],
  "eclipse not a boolean": ["invalid-value", "content/bulletins/bad.md:5:10 field 'eclipse': eclipse must be true or false (got 'yes'); expected true or false"],
  "empty title": ["invalid-value", "content/bulletins/bad.md:2:8 field 'title': title must be non-empty text (got ''); expected the bulletin title as text"],
  "file name not a slug": ["invalid-value", "content/bulletins/Weekly Notes.md: a bulletin file name is used in URLs and must be a lower-case slug (got 'Weekly Notes'); expected letters a–z, digits and hyphens, with an optional language, e.g. 'weekly.md' or 'weekly.es.md'"],
  "unknown site with suggestion": ["unknown-site", "content/bulletins/bad.md:5:5 field 'sites.1': unknown site 'harbor-roof'; expected one of cerro-lucero, harbour-roof, northern-outpost, southern-station — did you mean 'harbour-roof'?"],
};

function run(c: (typeof CASE_INPUTS)[number]): unknown {
  const file = c.file ?? 'content/bulletins/bad.md';
  try {
    const t = parseBulletin(c.text, file);
    if (c.stage === 'pages') pagesFor([t], { sites, today: '2026-12-04' });
    if (c.stage === 'render') renderBulletinSync(t, { site: sites.get('harbour-roof')!, week: isoWeekOf('2026-12-04'), bodies: new BodyRegistry() });
  } catch (error) {
    return error;
  }
  return undefined;
}

describe('bulletin error corpus', () => {
  it('has at least 30 cases, each with an expectation', () => {
    expect(CASE_INPUTS.length).toBeGreaterThanOrEqual(30);
    expect(Object.keys(EXPECTED).sort()).toEqual(CASE_INPUTS.map((c) => c.name).sort());
  });

  it.each(CASE_INPUTS.map((c) => [c.name, c] as const))('%s', (name, c) => {
    const error = run(c);
    expect(error).toBeInstanceOf(GloamingError);
    const [code, message] = EXPECTED[name]!;
    expect((error as GloamingError).code).toBe(code);
    expect((error as GloamingError).message).toBe(message);
  });

  it('every placeholder error names a line and a column inside the file', () => {
    for (const c of CASE_INPUTS.filter((x) => x.stage === 'render')) {
      const error = run(c) as GloamingError;
      const lines = c.text.split('\n').length;
      expect(error.place?.line, c.name).toBeGreaterThanOrEqual(1);
      expect(error.place?.line, c.name).toBeLessThanOrEqual(lines);
      expect(error.place?.column, c.name).toBeGreaterThanOrEqual(1);
    }
  });
});
