/**
 * `gloaming init <folder>`: scaffolds a new centre — `content/centre.yaml`, one site from the
 * coordinates given, a starter weekly template that passes `gloaming check` for a year at any
 * latitude, the weekly rebuild workflow, a `package.json` that depends on gloaming and pins the
 * Node it runs on, with the same `.npmrc` as gloaming (quiet about engines). Refuses a folder that
 * is not empty (nothing is overwritten). Prompting for missing values in a terminal happens at
 * the edge (`bin/gloaming.mjs`, with `INIT_QUESTIONS`); here everything comes as flags.
 */
import { existsSync, mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { defineSite } from '../../core/site.ts';
import { argumentError, numberFlag, requireFlag } from './args.ts';

/** The gloaming package's own folder (where the starter files and the example workflow live). */
const PACKAGE_ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../../..');

export const INIT_HELP = `gloaming init — start a new centre in an empty folder

Usage: gloaming init <folder> --name <centre> --lat <deg> --lon <deg> --tz <IANA zone> [options]

  --name <text>        the centre's name (content/centre.yaml)
  --lat <deg>          the first site's latitude, degrees north (−90…90)
  --lon <deg>          the first site's longitude, degrees east (−180…180)
  --tz <zone>          the site's IANA time zone, e.g. Europe/Madrid
  --site-name <text>   the site's name (default: Observing site)
  --elevation <m>      the site's height above sea level, metres (default 0)
  --package <spec>     what package.json depends on for gloaming (default: this copy of gloaming, as file:…)

In a terminal, missing values are asked for. The folder must be new or empty. Writes:
  content/centre.yaml, content/sites/<site>.yaml, content/bulletins/weekly.md,
  .github/workflows/weekly.yml, package.json, .npmrc, .gitignore
and prints the commands to run next.`;

/** The values `init` needs, with the question a terminal asks for each one that is missing. */
export const INIT_QUESTIONS = [
  { flag: 'name', question: "The centre's name (e.g. Example Astronomy Society): " },
  { flag: 'lat', question: "The observing site's latitude, degrees north (e.g. 40.42, or -33.9 in the south): " },
  { flag: 'lon', question: "The site's longitude, degrees east (e.g. -3.7 for west of Greenwich): " },
  { flag: 'tz', question: "The site's IANA time zone (e.g. Europe/Madrid): " },
] as const;

const OPTIONS = {
  name: { type: 'string' },
  lat: { type: 'string' },
  lon: { type: 'string' },
  tz: { type: 'string' },
  'site-name': { type: 'string' },
  elevation: { type: 'string' },
  package: { type: 'string' },
  help: { type: 'boolean', short: 'h' },
} as const;

/** The flags of `INIT_QUESTIONS` that `argv` (the arguments after `init`) does not give. */
export function missingInitFlags(argv: string[]): string[] {
  return INIT_QUESTIONS.map((q) => q.flag).filter((flag) => !argv.some((a) => a === `--${flag}` || a.startsWith(`--${flag}=`)));
}

/** A lower-case slug of a name: letters a–z, digits and hyphens. */
export function slug(text: string): string {
  const s = text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return s || 'site';
}

/** Text as a YAML double-quoted scalar (JSON strings are valid YAML). */
const yamlText = (text: string): string => JSON.stringify(text);

function centreYaml(name: string): string {
  return `# The centre that publishes the bulletins: every page, feed, calendar and social card reads it.
# See the README of gloaming ("The centre") for every field.
name: ${yamlText(name)}
# shortName: ${yamlText(name)}            # the breadcrumb
# The public address of the published site. Until it is set, builds are previews: their feeds,
# sitemap and cards link to http://localhost:4321/ and pages are marked noindex.
# url: https://sky.example.net/
# logo: logo.svg                        # a file in this folder (svg, png, jpg or webp)
accent: "#f3b962"                        # must keep WCAG AA contrast on the dark pages
locale: en-GB                            # 12/24-hour clock and date style of the sites
footer: |
  Times are worked out for each observing site from its coordinates.
# links:
#   - { label: Contact, href: "mailto:sky@example.net" }
`;
}

function siteYaml(input: { name: string; latitude: number; longitude: number; elevation: number; timeZone: string }): string {
  return `# An observing site. See the README of gloaming ("Sites and objects") for every field.
name: ${yamlText(input.name)}
latitude: ${input.latitude}
longitude: ${input.longitude}
elevation: ${input.elevation}
timeZone: ${input.timeZone}
sky: { bortle: 5 }          # 1 (pristine) … 9 (city centre); or { sqm: 20.5 } or { nelm: 5.5 }
minAltitude: 5              # degrees; lower targets are not recommended
# viewingHours: '19:00–23:00'   # default: 4 hours from sunset
# horizon:                      # the skyline: altitude (°) by azimuth (°)
#   - { azimuth: 90, altitude: 10 }
`;
}

function packageJson(input: { name: string; gloaming: string; node: string }): string {
  return `${JSON.stringify(
    {
      name: slug(input.name),
      private: true,
      type: 'module',
      description: `Weekly night-sky bulletins of ${input.name}, built with gloaming.`,
      engines: { node: '>=22.18' },
      scripts: {
        build: 'gloaming build',
        check: 'gloaming check --weeks 52',
        preview: 'gloaming preview',
      },
      dependencies: { gloaming: input.gloaming },
      // gloaming runs on Node's type stripping: the pinned Node runs every npm script and npx.
      devDependencies: { node: input.node },
    },
    null,
    2,
  )}\n`;
}

/** What `init` wrote, relative to the folder, and the commands to run next. */
export interface InitResult {
  folder: string;
  files: string[];
  next: string[];
}

/** The Node version range the gloaming package pins (its devDependency `node`). */
function pinnedNode(): string {
  const own = JSON.parse(readFileSync(join(PACKAGE_ROOT, 'package.json'), 'utf8')) as { devDependencies?: Record<string, string> };
  return own.devDependencies?.node ?? '^24.0.0';
}

/**
 * Scaffolds a centre in `folder` (created if missing; refused if not empty). Throws a
 * `GloamingError` naming the flag for a bad value; writes nothing then.
 */
export function initCentre(argv: string[], cwd: string = process.cwd()): InitResult {
  const { values, positionals } = parseArgs({ args: argv, options: OPTIONS, allowPositionals: true, strict: true });
  if (positionals.length !== 1) throw argumentError('<folder>', positionals.length ? 'give one folder' : 'is required', 'the folder to create, e.g. gloaming init my-centre', positionals.length ? positionals.join(' ') : undefined);
  const folder = resolve(cwd, positionals[0]!);
  if (existsSync(folder)) {
    if (!statSync(folder).isDirectory()) throw argumentError('<folder>', `'${positionals[0]}' is a file`, 'a new or empty folder');
    const entries = readdirSync(folder);
    if (entries.length > 0) {
      const shown = entries.sort().slice(0, 3).join(', ') + (entries.length > 3 ? ', …' : '');
      throw argumentError('<folder>', `'${positionals[0]}' is not empty (it holds ${shown}); nothing was written`, 'a new or empty folder, so that no file of yours is overwritten');
    }
  }
  const name = requireFlag(values.name, '--name', "the centre's name, e.g. --name 'Example Astronomy Society'").trim();
  if (!name) throw argumentError('--name', 'is empty', "the centre's name");
  const latitude = requireFlag(numberFlag(values.lat, '--lat', 'degrees north, −90 to 90'), '--lat', 'degrees north, −90 to 90');
  const longitude = requireFlag(numberFlag(values.lon, '--lon', 'degrees east, −180 to 180'), '--lon', 'degrees east, −180 to 180');
  const timeZone = requireFlag(values.tz, '--tz', "an IANA time zone such as 'Europe/Madrid'");
  const elevation = numberFlag(values.elevation, '--elevation', 'metres above sea level') ?? 0;
  const siteName = (values['site-name'] ?? 'Observing site').trim() || 'Observing site';
  const siteId = slug(siteName);
  // The same checks as a site file (ranges, a known zone that fits the longitude) before writing anything.
  const fieldFlags: Record<string, string> = { latitude: '--lat', longitude: '--lon', timeZone: '--tz', elevation: '--elevation' };
  try {
    defineSite({ id: siteId, name: siteName, latitude, longitude, elevation, timeZone, sky: { bortle: 5 } });
  } catch (error) {
    const field = (error as { place?: { field?: string } }).place?.field;
    if (field && fieldFlags[field]) throw argumentError(fieldFlags[field]!, (error as { detail?: string }).detail ?? String(error), 'a value a site file accepts');
    throw error;
  }
  const gloaming = values.package ?? `file:${PACKAGE_ROOT}`;

  const files: Record<string, string> = {
    'content/centre.yaml': centreYaml(name),
    [`content/sites/${siteId}.yaml`]: siteYaml({ name: siteName, latitude, longitude, elevation, timeZone }),
    'content/bulletins/weekly.md': readFileSync(join(PACKAGE_ROOT, 'lib/outputs/cli/starter/weekly.md'), 'utf8'),
    '.github/workflows/weekly.yml': readFileSync(join(PACKAGE_ROOT, '.github/workflows/weekly.yml'), 'utf8'),
    'package.json': packageJson({ name, gloaming, node: pinnedNode() }),
    // npm runs on the machine's Node and would warn about engines the pinned Node satisfies (see that file).
    '.npmrc': readFileSync(join(PACKAGE_ROOT, '.npmrc'), 'utf8'),
    '.gitignore': 'node_modules/\ndist/\n.astro/\n',
  };
  for (const [rel, text] of Object.entries(files)) {
    const path = join(folder, rel);
    mkdirSync(dirname(path), { recursive: true });
    writeFileSync(path, text, { flag: 'wx' });
  }
  const shownFolder = relative(cwd, folder) || '.';
  return {
    folder,
    files: Object.keys(files),
    next: [
      `cd ${shownFolder.includes(' ') ? JSON.stringify(shownFolder) : shownFolder}`,
      'npm install',
      'npx gloaming check --weeks 52      # every week of a year, every problem with its place',
      'npm run build                      # the site, into dist/',
      'npm run preview                    # look at it on http://localhost:4321/',
    ],
  };
}

/** `gloaming init` as a command: prints what it wrote and what to do next. */
export function runInit(argv: string[], out: (s: string) => void): number {
  if (argv.includes('--help') || argv.includes('-h')) {
    out(INIT_HELP);
    return 0;
  }
  const result = initCentre(argv);
  out(`created a new centre in ${basename(result.folder)}/:`);
  for (const f of result.files) out(`  ${f}`);
  out('');
  out('Next:');
  for (const line of result.next) out(`  ${line}`);
  out('');
  out('Then edit content/centre.yaml (url, logo, footer), the site file and content/bulletins/weekly.md.');
  return 0;
}
