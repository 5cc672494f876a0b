/**
 * `gloaming` command line: `position`, `night`, `week`, `events` and `passes`. Prints JSON with `--json`,
 * a short summary otherwise. Wrong input exits with code 2 and one line naming the argument,
 * the bad value and what is expected.
 */
import { parseArgs, type ParseArgsConfig } from 'node:util';
import { resolve } from 'node:path';
import { BodyRegistry, BUILT_IN_IDS, PLANET_IDS, type Body } from '../../core/body.ts';
import { loadBodies } from '../../models/content.ts';
import { loadObjectFile } from '../../models/orbit/elements.ts';
import { smallBody } from '../../models/orbit/body.ts';
import { isSmallBody } from '../../models/orbit/body.ts';
import { tailInSky } from '../../models/orbit/tail.ts';
import { compass, describeAltitude } from '../../core/describe.ts';
import { EXIT_CODES, GloamingError, quoteValue } from '../../core/errors.ts';
import { computeNight } from '../../models/night.ts';
import { observe } from '../../core/observe.ts';
import { formatClock, parseInstant, parseLocalDate } from '../../core/time.ts';
import { nightJson, positionJson, round, weekJson } from './format.ts';
import { argumentError, fileFlag, joinNegativeNumbers, requireFlag, siteFromFlags } from './args.ts';
import { EVENTS_HELP, runEvents } from './events.ts';
import { CHECK_HELP, runCheck } from './check.ts';
import { PASSES_HELP, runPasses } from './passes.ts';
import { INIT_HELP, runInit } from './init.ts';
import { runSites, SITES_HELP } from './sites.ts';
import { OBJECTS_HELP, runObjects } from './objects.ts';
import { computeWeek } from '../../models/week.ts';
import { reasonText } from '../../models/visibility.ts';
import { MISSING_REASON_TEXT, type EventTime } from '../../core/events.ts';
import { PHASE_LABEL, printedLitFraction } from '../../core/moon.ts';

const FLAG_OF_FIELD: Record<string, string> = {
  latitude: '--lat',
  longitude: '--lon',
  elevation: '--elevation',
  timeZone: '--tz',
  sky: '--sky',
  date: '--date',
  at: '--at',
  body: '--body',
  site: '--site',
  from: '--from',
  to: '--to',
  prodid: '--prodid',
  now: '--now',
};

const COMMON = {
  lat: { type: 'string' },
  lon: { type: 'string' },
  elevation: { type: 'string' },
  site: { type: 'string' },
  content: { type: 'string' },
  body: { type: 'string', multiple: true },
  elements: { type: 'string' },
  json: { type: 'boolean' },
  help: { type: 'boolean', short: 'h' },
} as const satisfies ParseArgsConfig['options'];

/** `build` and `preview` start Astro, so bin/gloaming.mjs runs them (scripts/site-commands.ts). */
export const SITE_COMMANDS_HELP = `gloaming build — build the site of a content folder (run as 'npx gloaming build')

Usage: gloaming build [--today YYYY-MM-DD] [--sites a,b] [--out dist] [--content content] [--strict] [--verbose]
       gloaming build --merge <shard folders…> --out dist
       gloaming preview [--out dist] [--port 4321]

Paths are relative to the working folder. The options are those of 'npm run build' (docs/deploy.md).`;

const HELP: Record<string, string> = {
  events: EVENTS_HELP,
  check: CHECK_HELP,
  passes: PASSES_HELP,
  init: INIT_HELP,
  sites: SITES_HELP,
  objects: OBJECTS_HELP,
  main: `gloaming — computed night-sky bulletins

Usage: gloaming <command> [options]

Commands:
  position   where a body is at one instant (topocentric and J2000 coordinates, altitude, magnitude)
  night      the night that begins on a local evening: twilight, the Moon, rise/transit/set, best time and verdict
  week       the seven nights of the ISO week containing a date: best night and the week's changes per body
  events     the sky's events for a site and date range (Moon phases, close approaches, showers, eclipses …); --ics for a calendar
  check      render every bulletin template for every site and week of a span and list every problem with its place
  passes     satellite passes over a site: when, where, how bright, and whether the public can see them
  init       start a new centre in an empty folder: centre.yaml, a site, a weekly template, the CI workflow
  sites      list the sites of the content folder (--shards <n>: groups for a CI matrix)
  objects    'objects add': import a comet's or asteroid's elements (MPC one-line formats, JPL SBDB) into content/objects/
  build      build the site of ./content into ./dist (the options of 'npm run build', see docs/deploy.md)
  preview    serve ./dist on http://localhost:4321/ to look at a build

Run 'gloaming <command> --help' for the options of a command.`,
  position: `gloaming position — where a body is at one instant

Usage: gloaming position (--lat <deg> --lon <deg> [--elevation <m>] | --site <id>) --at <instant> --body <id> [--json]

  --lat <deg>         latitude, degrees north (−90…90)
  --lon <deg>         longitude, degrees east (−180…180)
  --elevation <m>     height above sea level, metres (default 0)
  --site <id>         a site from content/sites/ instead of --lat/--lon
  --at <instant>      ISO 8601 instant with zone, e.g. 2026-12-04T18:30:00Z
  --body <id>         ${BUILT_IN_IDS.join(', ')}, or an object id from content/objects/
  --elements <file>   an object file (comet or asteroid elements, YAML) from anywhere, in place of --body
  --content <dir>     content folder (default ./content)
  --json              print one JSON object`,
  night: `gloaming night — the night that begins on a local evening

Usage: gloaming night (--lat <deg> --lon <deg> [--elevation <m>] --tz <zone> | --site <id>) --date <YYYY-MM-DD>
                      [--body <id> ...] [--sky bortle:<n>|sqm:<x>|nelm:<x>] [--json]

  --lat, --lon, --elevation, --site, --content   as for 'position'
  --tz <zone>         IANA time zone, e.g. Europe/Berlin
  --date <date>       local date of the evening, YYYY-MM-DD
  --body <id>         repeatable; default: all planets (the Moon has its own entry)
  --elements <file>   also observe the comet or asteroid defined in this object file
  --sky <quality>     bortle:<1–9>, sqm:<mag/arcsec²> or nelm:<magnitude>
  --json              print one JSON object

Event times are ISO 8601 with the site's UTC offset, or null when the event does not happen
between local noon and the next local noon (a reason is given). Each body also gets its best
viewing time, window and verdict (naked-eye, binoculars, telescope, not-visible) for the site's sky.`,
  week: `gloaming week — the ISO week (Monday–Sunday) containing a date

Usage: gloaming week (--lat <deg> --lon <deg> [--elevation <m>] --tz <zone> | --site <id>) --date <YYYY-MM-DD>
                     [--body <id> ...] [--sky bortle:<n>|sqm:<x>|nelm:<x>] [--json]

Options as for 'night'. Per body: the best night, magnitude on the first and last night, the
week's changes in words, the nights with Moon interference, and each night's best time and verdict.`,
};

function registry(values: Record<string, unknown>): BodyRegistry {
  const contentDir = resolve(String(values.content ?? 'content'));
  const reg = loadBodies(resolve(contentDir, 'objects'));
  if (typeof values.elements === 'string') {
    const body = smallBody(loadObjectFile(fileFlag(values.elements, '--elements', 'an object file (comet or asteroid elements, YAML)')));
    // An object file loaded from anywhere replaces a content object of the same id.
    return reg.ids().includes(body.id) ? new BodyRegistry({ catalogues: reg.catalogues }).add(body) : reg.add(body);
  }
  return reg;
}

function bodiesFrom(values: Record<string, unknown>, fallback: string[]): Body[] {
  const reg = registry(values);
  const ids = (values.body as string[] | undefined) ?? [];
  const bodies = ids.map((id) => reg.get(id, { field: 'body' }));
  if (typeof values.elements === 'string') {
    // `--elements` stands in for `--body`: the object it defines is observed.
    const id = reg.ids()[reg.ids().length - 1]!;
    bodies.push(reg.get(id));
  }
  return bodies.length ? bodies : fallback.map((id) => reg.get(id));
}

/** A 24-hour clock time in `zone`, rounded to the minute (as the pages print it). */
function hhmm(instant: Date, zone: string): string {
  return formatClock(instant, { locale: 'en-GB', timeZone: zone }, { clock: 24 });
}

function timeText(e: EventTime, zone: string): string {
  return e.time ? hhmm(e.time, zone) : `— (${MISSING_REASON_TEXT[e.reason]})`;
}

function runPosition(args: string[], out: (s: string) => void): void {
  const { values } = parseArgs({ args, options: { ...COMMON, at: { type: 'string' } }, strict: true });
  if (values.help) return out(HELP.position!);
  const site = siteFromFlags(values, { needZone: false });
  const at = parseInstant(requireFlag(values.at, '--at', 'an ISO 8601 instant, e.g. 2026-12-04T18:30:00Z'));
  const count = (values.body?.length ?? 0) + (values.elements ? 1 : 0);
  if (count === 0) throw argumentError('--body', 'is required', `a body id (${BUILT_IN_IDS.join(', ')}, or an object id) or --elements <file.yaml>`);
  if (count !== 1) throw argumentError('--body', "'position' takes exactly one body", 'one --body or one --elements', count);
  const [body] = bodiesFrom(values, []);
  const o = observe(site, body!, at);
  const tail = body!.kind === 'comet' && isSmallBody(body!) ? tailInSky(site, body!, at) : null;
  if (values.json) {
    return out(JSON.stringify({ ...positionJson(o), ...(tail ? { tail: { positionAngle: round(tail.positionAngleDeg, 2), skyAngle: round(tail.skyAngleDeg, 1), direction: tail.direction, words: tail.words } } : {}) }, null, 2));
  }
  const dir = compass(o.azimuthDeg);
  out(
    `${o.body.name} at ${o.time.date.toISOString()}: ${describeAltitude(o.altitudeDeg).words} in the ${dir.word} (azimuth ${round(o.azimuthDeg, 1)}°), ` +
      `magnitude ${round(o.magnitude.value, 1)}, in ${o.constellation}; ${round(o.elongationDeg, 1)}° from the Sun.` +
      (tail ? ` The tail ${tail.words}.` : ''),
  );
}

function runNight(args: string[], out: (s: string) => void): void {
  const { values } = parseArgs({
    args,
    options: { ...COMMON, tz: { type: 'string' }, date: { type: 'string' }, sky: { type: 'string' } },
    strict: true,
  });
  if (values.help) return out(HELP.night!);
  const site = siteFromFlags(values, { needZone: true });
  const date = requireFlag(values.date, '--date', 'the local date of the evening, YYYY-MM-DD');
  parseLocalDate(date);
  const bodies = bodiesFrom(values, [...PLANET_IDS]);
  const report = computeNight(site, date, bodies);
  if (values.json) return out(JSON.stringify(nightJson(report), null, 2));
  const zone = site.timeZone;
  const s = report.sun;
  const seenText = (b: (typeof report.bodies)[number]): string => {
    const v = b.visibility;
    const seen = v.best
      ? `best ${hhmm(v.best.time, zone)}${v.outsideViewingHours ? ' (outside viewing hours)' : ''}, ${compass(v.best.azimuthDeg).abbreviation} ${Math.round(v.best.altitudeDeg)}° up, ${v.verdict}`
      : `not visible: ${reasonText(v.reason!, site)}`;
    return `${seen}${b.guide && v.best ? `; ${b.guide.phrase}` : ''}`;
  };
  // The Moon has its own line; when it is also asked for as a body, its visibility joins that line.
  const moonBody = report.bodies.find((b) => b.body.id === 'moon');
  const lines = [
    `Night of ${date} at ${round(site.latitudeDeg, 4)}°, ${round(site.longitudeDeg, 4)}° (${zone})`,
    `Sun: sets ${timeText(s.set, zone)}, civil dusk ${timeText(s.civilDusk, zone)}, nautical dusk ${timeText(s.nauticalDusk, zone)}, ` +
      `astronomical dusk ${timeText(s.astronomicalDusk, zone)}; astronomical dawn ${timeText(s.astronomicalDawn, zone)}, rises ${timeText(s.rise, zone)}`,
    `Moon: ${PHASE_LABEL[report.moon.phase.name]}, ${Math.round(printedLitFraction(report.moon.phase) * 100)}% lit; rises ${timeText(report.moon.rise, zone)}, ` +
      `transits ${timeText(report.moon.transit, zone)}, sets ${timeText(report.moon.set, zone)}${moonBody ? `; ${seenText(moonBody)}` : ''}`,
    ...report.bodies
      .filter((b) => b !== moonBody)
      .map((b) => `${b.body.name}: rises ${timeText(b.rise, zone)}, transits ${timeText(b.transit, zone)}, sets ${timeText(b.set, zone)}; ${seenText(b)}`),
  ];
  out(lines.join('\n'));
}

function runWeek(args: string[], out: (s: string) => void): void {
  const { values } = parseArgs({
    args,
    options: { ...COMMON, tz: { type: 'string' }, date: { type: 'string' }, sky: { type: 'string' } },
    strict: true,
  });
  if (values.help) return out(HELP.week!);
  const site = siteFromFlags(values, { needZone: true });
  const date = requireFlag(values.date, '--date', 'a local date inside the week, YYYY-MM-DD');
  parseLocalDate(date);
  const bodies = bodiesFrom(values, ['moon', 'mercury', 'venus', 'mars', 'jupiter', 'saturn', 'uranus', 'neptune']);
  const report = computeWeek(site, date, bodies);
  if (values.json) return out(JSON.stringify(weekJson(report), null, 2));
  const zone = site.timeZone;
  const lines = [`Week ${report.week.id} (${report.week.days[0]} – ${report.week.days[6]}) at ${round(site.latitudeDeg, 4)}°, ${round(site.longitudeDeg, 4)}° (${zone})`];
  for (const b of report.bodies) {
    const best = b.nights.find((n) => n.date === b.bestNight)?.visibility;
    const when = best?.best ? `best on ${b.bestNight} at ${hhmm(best.best.time, zone)} (${best.verdict})` : `not visible this week: ${reasonText(b.nights[0]!.visibility.reason ?? 'too-faint', site)}`;
    lines.push(`${b.body.name}: ${when}${b.changes.length ? `; ${b.changes.join('; ')}` : ''}`);
  }
  out(lines.join('\n'));
}

/** What the command line's edge (bin/gloaming.mjs) passes in: the date, read from the clock there and nowhere in lib/. */
export interface CliContext {
  today?: string;
}

/** A command prints through `out` and returns its exit code (nothing means 0). */
const COMMANDS: Record<string, (args: string[], out: (s: string) => void, context: CliContext) => void | number> = {
  // These print and return nothing (some end with `return out(…)`, whose value is not a code).
  position: (args, out) => void runPosition(args, out),
  night: (args, out) => void runNight(args, out),
  week: (args, out) => void runWeek(args, out),
  events: (args, out) => void runEvents(args, out),
  check: runCheck,
  passes: (args, out) => void runPasses(args, out),
  sites: (args, out) => void runSites(args, out),
  init: (args, out) => runInit(args, out),
  objects: (args, out, context) => runObjects(args, out, context),
  // Run by bin/gloaming.mjs (they start Astro, which lib/ never imports); here only their help.
  build: (_args, out) => out(SITE_COMMANDS_HELP),
  preview: (_args, out) => out(SITE_COMMANDS_HELP),
};

/**
 * One line for a `parseArgs` error (its own messages run over three lines): the option it names
 * and what is wrong with it.
 */
function parseArgsLine(error: Error, command: string): string {
  const flag = /Option '(-{1,2}[\w-]+)/.exec(error.message)?.[1];
  const code = String((error as { code?: unknown }).code);
  if (flag && code === 'ERR_PARSE_ARGS_INVALID_OPTION_VALUE' && /ambiguous|missing/.test(error.message)) {
    return `${flag}: needs a value; see 'gloaming ${command} --help'`;
  }
  return `${error.message.split('\n')[0]!.replace(/\.$/, '')}; see 'gloaming ${command} --help'`;
}

/**
 * Runs the command line; returns the exit code. One convention for the command line and the
 * build (docs/deploy.md): 0 success, 2 a problem with the input (arguments, content files; the
 * message says what and where), 1 an unexpected failure (a bug: the message carries the stack) —
 * and for `check`, 1 also when it found problems in the templates.
 */
export function main(argv: string[], out: (s: string) => void = console.log, err: (s: string) => void = console.error, context: CliContext = {}): number {
  const [command, ...rest] = argv;
  if (!command || command === '--help' || command === '-h' || command === 'help') {
    out(HELP.main!);
    return command ? EXIT_CODES.ok : EXIT_CODES.input;
  }
  const run = COMMANDS[command];
  if (!run) {
    err(`gloaming: unknown command ${quoteValue(command)}; expected one of ${Object.keys(COMMANDS).join(', ')}`);
    return EXIT_CODES.input;
  }
  try {
    return run(joinNegativeNumbers(rest), out, context) ?? EXIT_CODES.ok;
  } catch (error) {
    if (error instanceof GloamingError) {
      const field = error.place?.field;
      const flag = field && !error.place?.file ? (field.startsWith('--') ? field : (FLAG_OF_FIELD[field.split('.')[0]!] ?? field)) : undefined;
      err(`gloaming ${command}: ${flag ? `${flag}: ${error.detail}` : error.message}`);
      return EXIT_CODES.input;
    }
    if (error instanceof Error && 'code' in error && String(error.code).startsWith('ERR_PARSE_ARGS')) {
      err(`gloaming ${command}: ${parseArgsLine(error, command)}`);
      return EXIT_CODES.input;
    }
    err(`gloaming ${command}: internal error: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`);
    return EXIT_CODES.unexpected;
  }
}

if (import.meta.main) {
  process.exitCode = main(process.argv.slice(2), console.log, console.error, { ...(process.env.GLOAMING_TODAY ? { today: process.env.GLOAMING_TODAY } : {}) });
}
