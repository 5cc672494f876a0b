/**
 * The error corpus's inputs: malformed bulletin templates (expected messages are in
 * bulletin-errors.test.ts). The default front matter takes lines 1–5; the body starts on line 6.
 */
export interface ErrorInput {
  name: string;
  /** Where the problem shows up: parsing the template, listing pages, or rendering. */
  stage: 'parse' | 'pages' | 'render';
  /** File name used in places (default `content/bulletins/bad.md`). */
  file?: string;
  text: string;
}

const FM = '---\ntitle: T\nsites: all\nschedule: { every: week }\n---\n';
const body = (markdown: string): string => FM + markdown + '\n';

export const CASE_INPUTS: ErrorInput[] = [
  // Placeholders (render stage)
  { name: 'unknown placeholder with suggestion', stage: 'render', text: body('Sun :sunsett.') },
  { name: 'unknown placeholder without suggestion', stage: 'render', text: body('A :frobnicate here.') },
  { name: 'unknown attribute', stage: 'render', text: body(':rise{body=jupiter nigth=fri}') },
  { name: 'unknown body', stage: 'render', text: body('Up at :rise{body=jupyter}.') },
  { name: 'missing body', stage: 'render', text: body(':rise') },
  { name: 'empty body', stage: 'render', text: body(':set{body=}') },
  { name: 'night name misspelt', stage: 'render', text: body(':sunset{night=funday}') },
  { name: 'night number out of range', stage: 'render', text: body(':sunset{night=8}') },
  { name: 'night date outside the week', stage: 'render', text: body(':sunset{night=2027-01-11}') },
  { name: 'clock out of range', stage: 'render', text: body(':sunset{clock=13}') },
  { name: 'time precision word', stage: 'render', text: body(':sunset{precision=hour}') },
  { name: 'digits out of range', stage: 'render', text: body(':altitude{body=mars at=transit precision=5}') },
  { name: 'digits not a number', stage: 'render', text: body(':magnitude{body=mars precision=x}') },
  { name: 'twilight kind unknown', stage: 'render', text: body(':dark{kind=nautcal}') },
  { name: 'moment unknown', stage: 'render', text: body(':direction{body=mars at=noon}') },
  { name: 'moment impossible clock time', stage: 'render', text: body(':altitude{body=mars at=25:00}') },
  { name: 'moment missing', stage: 'render', text: body(':altitude{body=mars}') },
  { name: 'style unknown', stage: 'render', text: body(':direction{body=mars at=set style=compass}') },
  { name: 'block placeholder written inline', stage: 'render', text: body('Table: :moon-and-twilight') },
  { name: 'inline placeholder written as a block', stage: 'render', text: body('::sunset') },
  { name: 'placeholder written as a container', stage: 'render', text: body(':::targets\nx\n:::') },
  { name: 'placeholder with a label', stage: 'render', text: body('At :sunset[today].') },
  { name: 'chart view unknown', stage: 'render', text: body('::chart{body=jupiter view=side}') },
  { name: 'event type unknown', stage: 'render', text: body('Intro.\n\nOn :event{type=full-mon}.') },
  { name: 'unclosed attribute braces', stage: 'render', text: body('Rises :rise{body=jupiter and more') },
  { name: 'unbalanced quote', stage: 'render', text: body('Rises :rise{body="jupiter} ok') },
  { name: 'block placeholder inside a paragraph', stage: 'render', text: body('See the table ::moon-and-twilight below.') },
  { name: 'attribute on a placeholder without attributes', stage: 'render', text: body(':week{night=1}') },
  { name: 'error on a later line and column', stage: 'render', text: body('# Title\n\nFirst line.\nThen :set{body=saturn night=0} here.') },
  { name: 'unknown body in front matter', stage: 'render', text: '---\ntitle: T\nsites: all\nschedule: { every: week }\nbodies: [venus, jupyter]\n---\nx\n' },
  // Front matter (parse stage)
  { name: 'no front matter', stage: 'parse', text: '# Just Markdown\n' },
  { name: 'front matter not closed', stage: 'parse', text: '---\ntitle: T\nsites: all\n' },
  { name: 'invalid YAML', stage: 'parse', text: '---\ntitle: [unclosed\nsites: all\n---\nx\n' },
  { name: 'missing title', stage: 'parse', text: '---\nsites: all\nschedule: { every: week }\n---\nx\n' },
  { name: 'unknown field with suggestion', stage: 'parse', text: '---\ntitle: T\nsites: all\nshedule: { every: week }\n---\nx\n' },
  { name: 'sites not a list', stage: 'parse', text: '---\ntitle: T\nsites: 5\nschedule: { every: week }\n---\nx\n' },
  { name: 'sites entry not a slug', stage: 'parse', text: '---\ntitle: T\nsites: [harbour-roof, Southern Station]\nschedule: { every: week }\n---\nx\n' },
  { name: 'site listed twice', stage: 'parse', text: '---\ntitle: T\nsites: [harbour-roof, harbour-roof]\nschedule: { every: week }\n---\nx\n' },
  { name: 'both date and schedule', stage: 'parse', text: '---\ntitle: T\nsites: all\ndate: 2026-12-04\nschedule: { every: week }\n---\nx\n' },
  { name: 'neither date nor schedule', stage: 'parse', text: '---\ntitle: T\nsites: all\n---\nx\n' },
  { name: 'impossible date', stage: 'parse', text: '---\ntitle: T\nsites: all\ndate: 2026-02-30\n---\nx\n' },
  { name: 'schedule past negative', stage: 'parse', text: '---\ntitle: T\nsites: all\nschedule:\n  every: week\n  past: -1\n---\nx\n' },
  { name: 'schedule every month', stage: 'parse', text: '---\ntitle: T\nsites: all\nschedule: { every: month }\n---\nx\n' },
  { name: 'schedule unknown field', stage: 'parse', text: '---\ntitle: T\nsites: all\nschedule: { every: week, futur: 2 }\n---\nx\n' },
  { name: 'eclipse not a boolean', stage: 'parse', text: '---\ntitle: T\nsites: all\ndate: 2026-08-12\neclipse: yes\n---\nx\n' },
  { name: 'empty title', stage: 'parse', text: '---\ntitle: ""\nsites: all\nschedule: { every: week }\n---\nx\n' },
  { name: 'file name not a slug', stage: 'parse', file: 'content/bulletins/Weekly Notes.md', text: body('x') },
  // Pages
  { name: 'unknown site with suggestion', stage: 'pages', text: '---\ntitle: T\nsites:\n  - southern-station\n  - harbor-roof\nschedule: { every: week }\n---\nx\n' },
];
