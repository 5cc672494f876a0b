/**
 * Finder charts (issue #7): the sky as the reader will see it, drawn as SVG text.
 *
 * - `horizonChart({ site, body, time, options })` — the view facing a target (lib/outputs/chart/horizon.ts).
 * - `wholeSkyChart({ site, time, body?, options })` — the whole sky as a disc (lib/outputs/chart/whole-sky.ts);
 *   `eveningMoment(report)` picks the end of nautical twilight.
 * - `horizonAltText(chart)`, `wholeSkyAltText(chart)` — alt text from the computed values.
 * - `ChartCache` — content-hash cache folder with progress reports; `chartImg` — the `<img>` markup.
 * - `placeholderChart(...)` — everything the `::chart{body night view}` placeholder needs.
 * - `stereographic(centre)` — the projection, with its inverse.
 */
import type { Body } from '../../core/body.ts';
import type { NightReport } from '../../models/night.ts';
import type { Site } from '../../core/site.ts';
import { reasonText, type Visibility } from '../../models/visibility.ts';
import type { ChartCache, ChartRequest, DeliveredChart } from './cache.ts';
import { eveningMoment } from './whole-sky.ts';

export { stereographic, stereographicRadius, angleFromRadius, makeLayout, type AltAz, type PlanePoint, type Stereographic } from './projection.ts';
export { horizonChart, type HorizonChart, type HorizonChartOptions, type ChartMark, type ChartLayout } from './horizon.ts';
export { wholeSkyChart, eveningMoment, type WholeSkyChart, type WholeSkyChartOptions } from './whole-sky.ts';
export { horizonAltText, wholeSkyAltText } from './alt.ts';
export {
  ChartCache,
  chartImg,
  chartKey,
  codeFingerprint,
  drawChart,
  rasterizeChart,
  CHART_BUDGET_BYTES,
  CHART_FORMAT_VERSION,
  type ChartCacheOptions,
  type ChartProgress,
  type ChartRequest,
  type DeliveredChart,
} from './cache.ts';
export { chartMagnitudeLimit, COLOURS, OKABE_ITO, CHART_WIDTH, MIN_FONT } from './style.ts';
export { formatChartTime, formatChartDate, formatMagnitude, chartLabel } from './words.ts';

/** What the `::chart` placeholder shows: the delivered chart, or why there is none. */
export type PlaceholderChart = { kind: 'chart'; chart: DeliveredChart } | { kind: 'not-visible'; reason: string };

/**
 * The chart for a `::chart{body=… night=… view=horizon|sky}` placeholder.
 *
 * - `view: 'horizon'` (default): the view facing `body` at its best time of the night
 *   (`visibility.best.time`), with its track over the week (`nightIndex` 0–6 of the week, so the
 *   dots cover the week's other nights). A body with no best time gets an honest sentence.
 * - `view: 'sky'`: the whole sky at the end of nautical twilight (`eveningMoment(report)`),
 *   with `body` highlighted.
 *
 * The caller copies the cache files it used (`chart.files`) into the published folder; the
 * placeholder (lib/outputs/bulletin/placeholders/charts.ts) writes the one markup of a chart on a page.
 */
export function placeholderChart(input: {
  site: Site;
  body: Body;
  report: NightReport;
  visibility: Visibility;
  nightIndex: number;
  view?: 'horizon' | 'sky';
  cache: ChartCache;
}): PlaceholderChart {
  const view = input.view ?? 'horizon';
  let request: ChartRequest;
  if (view === 'sky') {
    request = { kind: 'sky', site: input.site, time: eveningMoment(input.report), body: input.body };
  } else {
    const best = input.visibility.best;
    if (!best) {
      const reason = input.visibility.reason ? reasonText(input.visibility.reason, input.site) : 'not visible';
      return { kind: 'not-visible', reason };
    }
    const trackDays = [0, 1, 2, 3, 4, 5, 6].map((i) => i - input.nightIndex).filter((d) => d !== 0);
    request = { kind: 'horizon', site: input.site, body: input.body, time: best.time, options: { trackDays } };
  }
  return { kind: 'chart', chart: input.cache.get(request) };
}
