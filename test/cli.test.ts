/**
 * The `gloaming` command line: the public JSON shapes of `position` and `night` (field names from
 * issue #2, values cross-checked against `astronomia`), exit code 2 with one line naming the
 * argument for wrong input, `--help` for each command, and one run of the real binary on the
 * pinned Node.
 */
import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { Body, Equator, Horizon, MakeTime, Observer } from 'astronomy-engine';
import { main } from '../lib/outputs/cli/main.ts';
import { ARCMIN, separationDeg } from './helpers/tolerance.ts';
import { apparentTopocentric, jdUtOf, referenceEvents } from './reference/core/astronomia-reference.ts';

const ROOT = new URL('..', import.meta.url).pathname;

/** Runs the command line in-process, capturing stdout and stderr. */
function run(...argv: string[]): { code: number; out: string; err: string[] } {
  const out: string[] = [];
  const err: string[] = [];
  const code = main(argv, (s) => out.push(s), (s) => err.push(s));
  return { code, out: out.join('\n'), err };
}

const POSITION_NUMBERS = [
  'ra', 'dec', 'raJ2000', 'decJ2000', 'altitude', 'geometricAltitude', 'azimuth', 'distance',
  'geocentricDistance', 'heliocentricDistance', 'elongation', 'illuminatedFraction', 'magnitude',
] as const;

describe('gloaming position --json', () => {
  const at = '2026-12-04T19:30:00Z';
  const r = run('position', '--lat', '-33.92', '--lon', '18.42', '--at', at, '--body', 'jupiter', '--json');
  const json = JSON.parse(r.out) as Record<string, unknown>;

  it('exits 0 with every documented field (issue #2 §3), numbers finite', () => {
    expect(r.code).toBe(0);
    expect(json.body).toBe('jupiter');
    expect(Date.parse(String(json.at))).toBe(Date.parse(at));
    for (const key of POSITION_NUMBERS) {
      expect(typeof json[key], key).toBe('number');
      expect(Number.isFinite(json[key]), key).toBe(true);
    }
    expect(json.constellation).toMatch(/^[A-Z][A-Za-z]{2}$/);
    expect(['N', 'NNE', 'NE', 'ENE', 'E', 'ESE', 'SE', 'SSE', 'S', 'SSW', 'SW', 'WSW', 'W', 'WNW', 'NW', 'NNW']).toContain(json.direction);
    expect(json.ra as number).toBeGreaterThanOrEqual(0);
    expect(json.ra as number).toBeLessThan(24);
    expect(json.azimuth as number).toBeGreaterThanOrEqual(0);
    expect(json.azimuth as number).toBeLessThan(360);
  });

  it('ra/dec are the topocentric apparent position of date: within 1′ of astronomia (Meeus ch. 33, 40)', () => {
    const ref = apparentTopocentric('jupiter', { latitudeDeg: -33.92, longitudeDeg: 18.42, elevationM: 0 }, jdUtOf(new Date(at)));
    const sep = separationDeg(json.ra as number, json.dec as number, (ref.ra * 12) / Math.PI, (ref.dec * 180) / Math.PI);
    expect(sep).toBeLessThanOrEqual(ARCMIN);
  });
});

describe('gloaming night --json', () => {
  const r = run('night', '--lat', '52.52', '--lon', '13.4', '--tz', 'Europe/Berlin', '--date', '2026-12-04', '--body', 'saturn', '--body', 'venus', '--json');
  const json = JSON.parse(r.out) as {
    sun: Record<string, unknown>;
    moon: Record<string, unknown>;
    bodies: Record<string, unknown>[];
  };
  const ISO_WITH_OFFSET = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}[+-]\d{2}:\d{2}$/;

  it('exits 0 with sun, moon and bodies fields (issue #2 §3); event times are ISO 8601 with the local offset or null', () => {
    expect(r.code).toBe(0);
    for (const key of ['set', 'civilDusk', 'nauticalDusk', 'astronomicalDusk', 'astronomicalDawn', 'nauticalDawn', 'civilDawn', 'rise']) {
      expect(key in json.sun, key).toBe(true);
      expect(String(json.sun[key]), key).toMatch(ISO_WITH_OFFSET);
      expect(String(json.sun[key]).endsWith('+01:00'), key).toBe(true);
    }
    for (const key of ['rise', 'transit', 'set']) {
      expect(key in json.moon, key).toBe(true);
      const v = json.moon[key];
      if (v !== null) expect(String(v)).toMatch(ISO_WITH_OFFSET);
    }
    expect(typeof json.moon.phase).toBe('string');
    expect(Number.isFinite(json.moon.illuminatedFraction)).toBe(true);
    expect(json.bodies.map((b) => b.body)).toEqual(['saturn', 'venus']);
    for (const b of json.bodies) {
      for (const key of ['rise', 'transit', 'set']) {
        expect(key in b, `${String(b.body)} ${key}`).toBe(true);
        if (b[key] !== null) expect(String(b[key])).toMatch(ISO_WITH_OFFSET);
      }
    }
  });

  it('sunset and sunrise agree with astronomia (Meeus ch. 15) within 1 minute', () => {
    const start = jdUtOf(new Date('2026-12-04T11:00:00Z'));
    const ref = referenceEvents('sun', { latitudeDeg: 52.52, longitudeDeg: 13.4, elevationM: 0 }, start, start + 1);
    const set = ref.find((e) => e.kind === 'set')!;
    const rise = ref.find((e) => e.kind === 'rise')!;
    expect(Math.abs(jdUtOf(new Date(String(json.sun.set))) - set.jdUt) * 1440).toBeLessThanOrEqual(1);
    expect(Math.abs(jdUtOf(new Date(String(json.sun.rise))) - rise.jdUt) * 1440).toBeLessThanOrEqual(1);
  });

  it('each body says what its guide leads from (pattern, star, planet, moon or horizon)', () => {
    for (const b of json.bodies) {
      const guide = b.guide as { kind: string; phrase: string } | null;
      if (b.best === null) continue;
      expect(['pattern', 'star', 'planet', 'moon', 'horizon'], String(b.body)).toContain(guide?.kind);
      expect(guide!.phrase.length, String(b.body)).toBeGreaterThan(10);
    }
  });

  it('without --body covers the Moon and all planets', () => {
    const all = JSON.parse(run('night', '--lat', '0', '--lon', '0', '--tz', 'UTC', '--date', '2030-01-01', '--json').out) as { bodies: { body: string }[] };
    for (const id of ['mercury', 'venus', 'mars', 'jupiter', 'saturn', 'uranus', 'neptune']) {
      expect(all.bodies.map((b) => b.body)).toContain(id);
    }
  });
});

describe('wrong input: exit code 2 and one line naming the argument', () => {
  const cases: { what: string; argv: string[]; names: RegExp; mentions?: RegExp }[] = [
    { what: 'unknown body', argv: ['position', '--lat', '50', '--lon', '0', '--at', '2026-01-01T00:00Z', '--body', 'jupyter'], names: /--body/, mentions: /jupyter.*did you mean 'jupiter'/ },
    { what: 'latitude 95', argv: ['position', '--lat', '95', '--lon', '0', '--at', '2026-01-01T00:00Z', '--body', 'mars'], names: /--lat/, mentions: /95.*-90.*90/ },
    { what: 'latitude not a number', argv: ['night', '--lat', 'north', '--lon', '0', '--tz', 'UTC', '--date', '2026-01-01'], names: /--lat/, mentions: /north/ },
    { what: 'unparseable date', argv: ['night', '--lat', '50', '--lon', '0', '--tz', 'UTC', '--date', '2026-02-30'], names: /--date/, mentions: /2026-02-30.*YYYY-MM-DD/ },
    { what: 'unparseable instant', argv: ['position', '--lat', '50', '--lon', '0', '--at', 'yesterday', '--body', 'mars'], names: /--at/, mentions: /yesterday/ },
    { what: 'unknown zone', argv: ['night', '--lat', '50', '--lon', '0', '--tz', 'Europe/Atlantis', '--date', '2026-01-01'], names: /--tz/, mentions: /Europe\/Atlantis.*IANA/ },
    { what: 'missing --lat', argv: ['night', '--lon', '0', '--tz', 'UTC', '--date', '2026-01-01'], names: /--lat/, mentions: /required/ },
    { what: 'missing --date', argv: ['night', '--lat', '50', '--lon', '0', '--tz', 'UTC'], names: /--date/, mentions: /required/ },
    { what: 'missing --body for position', argv: ['position', '--lat', '50', '--lon', '0', '--at', '2026-01-01T00:00Z'], names: /--body/ },
    { what: 'unknown flag', argv: ['night', '--lat', '50', '--lon', '0', '--tz', 'UTC', '--date', '2026-01-01', '--frobnicate'], names: /--frobnicate/ },
    { what: 'unknown command', argv: ['tonight'], names: /tonight/ },
  ];
  for (const c of cases) {
    it(c.what, () => {
      const r = run(...c.argv);
      expect(r.code).toBe(2);
      expect(r.out).toBe('');
      expect(r.err).toHaveLength(1);
      expect(r.err[0]!.split('\n')).toHaveLength(1);
      expect(r.err[0]).toMatch(c.names);
      if (c.mentions) expect(r.err[0]).toMatch(c.mentions);
    });
  }
});

describe('--help', () => {
  for (const command of ['position', 'night']) {
    it(`gloaming ${command} --help exits 0 and prints the usage`, () => {
      const r = run(command, '--help');
      expect(r.code).toBe(0);
      expect(r.err).toEqual([]);
      expect(r.out).toContain(`gloaming ${command}`);
      expect(r.out).toContain('Usage:');
    });
  }
  it('gloaming --help exits 0 and lists the commands', () => {
    const r = run('--help');
    expect(r.code).toBe(0);
    expect(r.out).toContain('position');
    expect(r.out).toContain('night');
  });
});

describe('the real binary', () => {
  it('npx gloaming night … --json runs on the pinned Node (≥ 22.18) from the repository root', () => {
    const stdout = execFileSync('npx', ['gloaming', 'night', '--lat', '-45', '--lon', '170', '--tz', 'Pacific/Auckland', '--date', '2027-01-01', '--body', 'mars', '--json'], {
      cwd: ROOT,
      encoding: 'utf8',
      env: { ...process.env, NODE_OPTIONS: '' },
    });
    const json = JSON.parse(stdout) as { date: string; start: string; bodies: { body: string }[] };
    expect(json.date).toBe('2027-01-01');
    expect(json.start).toBe('2027-01-01T12:00:00+13:00');
    expect(json.bodies[0]!.body).toBe('mars');
    const version = execFileSync('npx', ['node', '--version'], { cwd: ROOT, encoding: 'utf8' }).trim();
    const [major, minor] = version.replace(/^v/, '').split('.').map(Number) as [number, number];
    expect(major > 22 || (major === 22 && minor >= 18), version).toBe(true);
  });
});

describe('honest text on the command line (issue #13)', () => {
  it('a body below the horizon is said to be below it, never "−13° … up"', () => {
    // Jupiter at noon UTC on 2026-12-10 from 51° N: below the horizon (astronomy-engine Horizon, checked here).
    const at = '2026-12-10T15:00:00Z';
    const r = run('position', '--lat', '51', '--lon', '-1.5', '--at', at, '--body', 'jupiter');
    const t = MakeTime(new Date(at));
    const observer = new Observer(51, -1.5, 0);
    const eq = Equator(Body.Jupiter, t, observer, true, true);
    const alt = Horizon(t, observer, eq.ra, eq.dec, 'normal').altitude;
    expect(alt).toBeLessThan(-1);
    expect(r.out).toContain(`${Math.round(-alt)}° below the horizon`);
    expect(r.out).not.toMatch(/−?\d+° \([^)]*\) up/);
  });

  it('night --body moon lists the Moon once', () => {
    const r = run('night', '--lat', '51', '--lon', '-1.5', '--tz', 'Europe/London', '--date', '2026-12-20', '--body', 'moon', '--body', 'jupiter');
    expect(r.code).toBe(0);
    expect(r.out.match(/^Moon\b/gm)).toHaveLength(1);
    expect(r.out).toMatch(/^Moon: .*% lit; rises .*; (best|not visible)/m);
  });

  it('events text rounds clock times to the minute as the sentences do (no truncation)', () => {
    const json = JSON.parse(run('events', '--lat', '51', '--lon', '-1.5', '--tz', 'Europe/London', '--from', '2026-12-07', '--json').out) as { events: { time: string; description: string }[] };
    const text = run('events', '--lat', '51', '--lon', '-1.5', '--tz', 'Europe/London', '--from', '2026-12-07').out.split('\n').slice(1);
    expect(text.length).toBe(json.events.length);
    let rounded = 0;
    json.events.forEach((e, i) => {
      // Round half up to the minute, from the ISO time with its offset (independent of lib/core/time.ts).
      const ms = Date.parse(e.time);
      const local = new Date(Math.round(ms / 60_000) * 60_000 + (Number(e.time.slice(-6, -3)) * 60 + Number(e.time.slice(-2)) * Math.sign(Number(e.time.slice(-6, -3)) || 1)) * 60_000);
      const expected = local.toISOString().slice(0, 16).replace('T', ' ');
      expect(text[i]!.startsWith(expected), `${text[i]} vs ${e.time}`).toBe(true);
      if (Number(e.time.slice(17, 19)) >= 30) rounded++;
      const clock = /at (\d\d:\d\d)/.exec(e.description);
      if (clock) expect(expected.slice(11)).toBe(clock[1]);
    });
    expect(rounded).toBeGreaterThan(0);
  });
});
