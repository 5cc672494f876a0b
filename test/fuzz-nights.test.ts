/**
 * A seeded property test over site-nights (issue #14 §8): latitudes up to ±90°, zones with
 * unusual and historical offsets (30- and 45-minute zones, the Chatham Islands' +12:45, Dublin's
 * −00:25:21 before 1916, Monrovia's −00:44:30 before 1972), daylight-saving change days, dates
 * 1900–2100, and random comet and asteroid orbits (e near and at 1, perihelia down to 0.005 AU).
 *
 * Every case is the command line's `night --json` object (`nightJson`), checked for:
 * - no exception;
 * - no NaN, Infinity or undefined anywhere, and no 'NaN', 'undefined' or 'Invalid Date' in a string;
 * - every event time inside its night (local noon to local noon); a date the zone skipped
 *   (Pacific/Apia, 2011-12-30) is refused with an `invalid-date` error instead of an empty night;
 * - the best time inside its window;
 * - a verdict consistent with the margin: visible verdicts have a best moment whose margin is at
 *   least the required margin (`requiredMargin` when the JSON carries it, else 0) and a window;
 *   'not-visible' has a reason.
 *
 * `npm test` runs FUZZ_CASES (default 2,000; the seed is FUZZ_SEED, default 14). Run more with
 * `FUZZ_CASES=10000 npx vitest run test/fuzz-nights.test.ts` (docs: DEVELOPERS.md). A failure
 * prints the case, so it can be replayed.
 */
import { describe, expect, it } from 'vitest';
import { builtInBody, type BUILT_IN_IDS, type Body } from '../lib/core/body.ts';
import { nightJson } from '../lib/outputs/cli/format.ts';
import { computeNight } from '../lib/models/night.ts';
import { smallBody } from '../lib/models/orbit/body.ts';
import { parseObject } from '../lib/models/orbit/elements.ts';
import { GloamingError } from '../lib/core/errors.ts';
import { defineSite } from '../lib/core/site.ts';
import { addDays, formatLocalDate } from '../lib/core/time.ts';
import { seededRandom } from './helpers/random.ts';

const CASES = Number(process.env.FUZZ_CASES ?? 2000);
const SEED = Number(process.env.FUZZ_SEED ?? 14);

/** Zones with unusual or historical offsets (IANA tz database names). */
const ZONES = [
  'UTC', 'Europe/London', 'Europe/Dublin', 'Europe/Amsterdam', 'Europe/Berlin', 'Europe/Moscow', 'Africa/Monrovia',
  'America/St_Johns', 'America/Caracas', 'America/Santiago', 'America/Anchorage', 'America/Los_Angeles',
  'Pacific/Honolulu', 'Pacific/Kiritimati', 'Pacific/Chatham', 'Pacific/Apia', 'Pacific/Marquesas',
  'Asia/Kolkata', 'Asia/Kathmandu', 'Asia/Tehran', 'Asia/Kabul', 'Australia/Eucla', 'Australia/Lord_Howe', 'Antarctica/Troll',
];
const PLANETS = ['mercury', 'venus', 'mars', 'jupiter', 'saturn', 'uranus', 'neptune', 'sun'];

/** Days on which clocks changed in some of these zones (DST starts and ends), in the years drawn. */
const DST_DAYS = ['2026-03-08', '2026-03-29', '2026-10-25', '2026-11-01', '2026-04-05', '2026-09-27', '1916-05-21', '1916-10-01', '2100-03-28', '2011-12-29'];

interface Case {
  latitude: number;
  longitude: number;
  elevation: number;
  zone: string;
  date: string;
  planet: string;
  orbit: string | null;
}

function drawCase(random: () => number): Case {
  const pick = <T,>(list: readonly T[]): T => list[Math.floor(random() * list.length)]!;
  const r = random();
  // A tenth of the cases sit at or next to a pole or on the equator.
  const latitude = r < 0.04 ? pick([90, -90]) : r < 0.07 ? pick([89.99, -89.99, 0]) : Math.round((random() * 180 - 90) * 1000) / 1000;
  const longitude = Math.round((random() * 360 - 180) * 1000) / 1000;
  let date: string;
  if (random() < 0.15) date = addDays(pick(DST_DAYS), Math.floor(random() * 3) - 1);
  else {
    const year = 1900 + Math.floor(random() * 201);
    date = addDays(formatLocalDate(year, 1, 1), Math.floor(random() * 365));
  }
  return {
    latitude,
    longitude,
    elevation: Math.round(random() < 0.8 ? random() * 500 : random() * 5000),
    zone: pick(ZONES),
    date,
    planet: pick(PLANETS),
    orbit: random() < 0.35 ? drawOrbit(random, date) : null,
  };
}

/** An object file for a random comet (q, e up to and including 1) or asteroid (a, e, M). */
function drawOrbit(random: () => number, date: string): string {
  const angles = `  inclination: ${(random() * 180).toFixed(3)}\n  ascendingNode: ${(random() * 360).toFixed(3)}\n  argumentOfPerihelion: ${(random() * 360).toFixed(3)}\n`;
  if (random() < 0.7) {
    const e = random() < 0.3 ? 1 : random() < 0.5 ? 1 - 10 ** -(2 + random() * 6) : random() * 0.99;
    const q = random() < 0.2 ? 0.005 + random() * 0.05 : 0.1 + random() * 5;
    const t = new Date(Date.parse(`${date}T00:00:00Z`) + (random() - 0.5) * 400 * 86_400_000).toISOString().slice(0, 19) + 'Z';
    return `id: fuzz-comet\nname: Fuzz comet\nkind: comet\nelements:\n  perihelionDistance: ${q.toFixed(6)}\n  eccentricity: ${e}\n${angles}  perihelionTime: ${t}\nmagnitude:\n  M1: ${(random() * 15).toFixed(2)}\n  K1: ${(5 + random() * 10).toFixed(2)}\nsource: fuzz\n`;
  }
  const a = 0.6 + random() * 5;
  return `id: fuzz-asteroid\nname: Fuzz asteroid\nkind: asteroid\nelements:\n  semiMajorAxis: ${a.toFixed(5)}\n  eccentricity: ${(random() * 0.9).toFixed(5)}\n${angles}  meanAnomaly: ${(random() * 360).toFixed(3)}\n  epoch: ${date}T00:00:00Z\nmagnitude:\n  H: ${(random() * 20).toFixed(2)}\n  G: 0.15\nsource: fuzz\n`;
}

/** Reads an ISO 8601 instant with an offset of the form ±hh:mm or ±hh:mm:ss (Date cannot read the latter). */
function instantOf(text: string): number {
  const m = /^(\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2})([+-])(\d{2}):(\d{2})(?::(\d{2}))?$/.exec(text);
  if (!m) return Number.NaN;
  const offset = (Number(m[3]) * 3600 + Number(m[4]) * 60 + Number(m[5] ?? 0)) * (m[2] === '-' ? -1 : 1);
  return Date.parse(`${m[1]}Z`) - offset * 1000;
}

/**
 * Whether the wall clocks of `zone` ever showed `date`, read straight from the platform's zone data
 * (hourly, two days either side). Pacific/Apia skipped 2011-12-30 (IANA tz database, file
 * `australasia`: Samoa moved west of the date line at the end of 29 December 2011).
 */
function dateExists(date: string, zone: string): boolean {
  const f = new Intl.DateTimeFormat('en-CA', { timeZone: zone, year: 'numeric', month: '2-digit', day: '2-digit' });
  const t0 = Date.parse(`${date}T00:00:00Z`) - 2 * 86_400_000;
  for (let h = 0; h <= 96; h++) if (f.format(new Date(t0 + h * 3_600_000)) === date) return true;
  return false;
}

/** Paths of values that must never be published. */
function badValues(value: unknown, path = ''): string[] {
  if (value === undefined) return [`${path}: undefined`];
  if (typeof value === 'number') return Number.isFinite(value) ? [] : [`${path}: ${value}`];
  if (typeof value === 'string') return /NaN|undefined|Invalid Date/.test(value) ? [`${path}: '${value}'`] : [];
  if (Array.isArray(value)) return value.flatMap((v, i) => badValues(v, `${path}[${i}]`));
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => badValues(v, path ? `${path}.${k}` : k));
  return [];
}

interface VisibilityJson {
  best: { time: string; margin: number; requiredMargin?: number } | null;
  window: { start: string; end: string } | null;
  verdict: string;
  reason: string | null;
  requiredMargin?: number;
}

/** Every property of one night's JSON; returns the problems found. */
function problems(json: Record<string, unknown>): string[] {
  const found = badValues(json);
  const start = instantOf(json.start as string);
  const end = instantOf(json.end as string);
  const inside = (label: string, t: unknown): void => {
    if (t === null || t === undefined) return;
    const ms = instantOf(t as string);
    if (!(ms >= start - 1000 && ms <= end + 1000)) found.push(`${label} ${String(t)} outside the night ${String(json.start)} … ${String(json.end)}`);
  };
  const sun = json.sun as Record<string, unknown>;
  for (const [k, v] of Object.entries(sun)) if (k !== 'reasons') inside(`sun.${k}`, v);
  const moon = json.moon as Record<string, unknown>;
  for (const k of ['rise', 'transit', 'set']) inside(`moon.${k}`, moon[k]);
  for (const b of json.bodies as (VisibilityJson & Record<string, unknown>)[]) {
    const id = String(b.body);
    for (const k of ['rise', 'transit', 'set']) inside(`${id}.${k}`, b[k]);
    inside(`${id}.best.time`, b.best?.time);
    inside(`${id}.window.start`, b.window?.start);
    inside(`${id}.window.end`, b.window?.end);
    if (b.best && b.window) {
      const t = instantOf(b.best.time);
      if (!(t >= instantOf(b.window.start) - 1000 && t <= instantOf(b.window.end) + 1000)) found.push(`${id}: best time ${b.best.time} outside its window ${b.window.start} … ${b.window.end}`);
    }
    if (b.verdict === 'not-visible') {
      if (!b.reason) found.push(`${id}: not visible without a reason`);
    } else {
      const required = b.best?.requiredMargin ?? b.requiredMargin ?? 0;
      // Margins are printed to 0.01 mag.
      if (!b.best || !(b.best.margin >= required - 0.005)) found.push(`${id}: verdict ${b.verdict} with margin ${String(b.best?.margin)} (required ${required})`);
      if (!b.window) found.push(`${id}: verdict ${b.verdict} without a window`);
    }
  }
  return found;
}

describe(`fuzzed site-nights (${CASES} cases, seed ${SEED})`, () => {
  it('never throw, never publish NaN or undefined, keep events in their night and verdicts consistent', () => {
    const random = seededRandom(SEED);
    const failures: string[] = [];
    // What the cases covered: the properties must have been tested on each kind of night.
    const seen = { visible: 0, notVisible: 0, secondsOffset: 0, polarNull: 0, smallBodies: 0, skippedDate: 0 };
    for (let i = 0; i < CASES && failures.length < 5; i++) {
      const c = drawCase(random);
      try {
        // Any zone with any place: the zone-versus-longitude sanity check is switched off (zoneTolerance 12 h).
        const site = defineSite({ latitude: c.latitude, longitude: c.longitude, elevation: c.elevation, timeZone: c.zone, zoneTolerance: 12 });
        const bodies: Body[] = [builtInBody(c.planet as (typeof BUILT_IN_IDS)[number])];
        if (c.orbit) bodies.push(smallBody(parseObject(c.orbit, 'fuzz.yaml')));
        const json = nightJson(computeNight(site, c.date, bodies));
        for (const p of problems(json)) failures.push(`case ${i} ${JSON.stringify(c)}: ${p}`);
        for (const b of json.bodies as VisibilityJson[]) seen[b.verdict === 'not-visible' ? 'notVisible' : 'visible']++;
        if (/[+-]\d\d:\d\d:\d\d$/.test(json.start as string)) seen.secondsOffset++;
        if ((json.sun as { set: unknown }).set === null) seen.polarNull++;
        if (c.orbit) seen.smallBodies++;
      } catch (error) {
        // A date the zone's clocks skipped has no night: a clear input error is the right answer.
        if (error instanceof GloamingError && error.code === 'invalid-date' && !dateExists(c.date, c.zone)) {
          seen.skippedDate++;
          continue;
        }
        failures.push(`case ${i} ${JSON.stringify(c)}: threw ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`);
      }
    }
    expect(failures).toEqual([]);
    for (const [kind, count] of Object.entries(seen)) if (kind !== 'skippedDate') expect(count, `cases with ${kind}`).toBeGreaterThan(CASES >= 1000 ? 5 : 0);
  }, 600_000);
});
