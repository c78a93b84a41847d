/**
 * How a code-table value is cited to the people who read it: a short citation (edition, table or
 * section, and what kind of text it rests on) and the row's note in plain words. The reference
 * files carry provenance for the people who maintain them (tags such as [S-ed], "FLAG:", dataset
 * paths, commits, links); none of that reaches a screen.
 */

import type { Citation, CitationLayer } from '../../../contract/result.js';

export type { Citation, CitationLayer } from '../../../contract/result.js';

export interface CitationInput {
  /** The edition as people name it, e.g. "IECC 2021" (see `editionName`). */
  edition: string;
  /** The table or section the value belongs to, e.g. "Table C405.3.2(2)" or "C405.2.1"; empty when unknown. */
  reference: string;
  source: string;
  confidence: string;
  /** The reference files' provenance tag, where the row has one: [S], [S-ed], [I] or [M]. */
  tag?: string | null;
  verified: boolean;
  note?: string | null;
  /** What the row recalls from memory, kept apart from its note in the files. */
  fromMemory?: string | null;
}

const notChecked = 'not yet checked against the printed code';

/** "IECC 2021", "ASHRAE 90.1-2019": the names engineers write beside a value. */
export function editionName(family: 'iecc' | 'ashrae-90.1', year: number): string {
  return family === 'iecc' ? `IECC ${year}` : `ASHRAE 90.1-${year}`;
}

const statePatterns: [RegExp, string][] = [
  [/washington|leg\.wa\.gov|\bWSEC\b|\bWAC\b/i, 'Washington'],
  [/colorado/i, 'Colorado'],
  [/massachusetts/i, 'Massachusetts'],
  [/oregon/i, 'Oregon'],
  [/district[- ]of[- ]columbia|\bDC 12-/i, 'District of Columbia'],
];

/** Sources that are modelling or rule-checking code, not the text of a code. */
const modellingSourcePattern = /openstudio-standards|ConStrain|ruleset-checking|\.rb\b/i;

const secondaryPattern = /secondary summary|manufacturer|forum|blog|leeduser|mikeholt|squarespace|aiadallas|hortoncontrols|mhcompanies/i;

function layerOf(input: CitationInput): CitationLayer {
  const tag = input.tag?.trim() ?? '';
  const confidence = input.confidence.trim().toLowerCase();
  const note = `${input.note ?? ''} ${input.fromMemory ?? ''}`;
  // The tag says what the value rests on where the row has one; the source and confidence decide where it has none.
  if (tag === '[M]') return 'not-checked';
  if (tag === '[S-ed]') return 'other-edition-or-state';
  if (tag === '[I]') return 'modelling-dataset';
  if (/^(from memory|not found)/i.test(input.source.trim()) || ['from memory', 'none', 'not sourced'].includes(confidence))
    return 'not-checked';
  if (confidence === 'interpretation' || (tag === '' && /\[I\]/.test(note))) return 'modelling-dataset';
  if (
    otherEditionCited(input) !== null ||
    statePatterns.some(([pattern]) => pattern.test(input.source)) ||
    secondaryPattern.test(input.source) ||
    (tag === '' && /\[S-ed\]/.test(note))
  ) {
    return 'other-edition-or-state';
  }
  return 'model-code';
}

/** The other edition a row's own source annotation names ("From 90.1-2013 Section 9.6.2" on a 90.1-2019 row), if any. */
function otherEditionCited(input: CitationInput): string | null {
  const cited = /From\s+((?:ASHRAE\s+)?90\.1-\d{4}|IECC-?\s?\d{4})/.exec(input.note ?? '')?.[1];
  const year = cited?.slice(-4);
  return cited && year && !input.edition.includes(year) ? cited.replace(/^IECC-?\s?/, 'IECC ') : null;
}

/** Where a value stands in, which text it stands on: a named state, a secondary summary, or another edition. */
function standInWords(input: CitationInput): string {
  const stateOf = (text: string) => statePatterns.find(([pattern]) => pattern.test(text))?.[1];
  const sourceState = stateOf(input.source);
  if (sourceState) return `${sourceState} state text standing in for the model code`;
  if (secondaryPattern.test(input.source)) return 'a secondary summary of the code, not its text';
  // Another edition as modelling code reads it (a state named in the note then qualifies a detail, not the value).
  if (input.confidence.trim().toLowerCase() === 'interpretation' || modellingSourcePattern.test(input.source))
    return "another edition's modelling reading standing in for this one";
  const noteState = stateOf(input.note ?? '');
  if (noteState) return `${noteState} state text standing in for the model code`;
  const other = otherEditionCited(input);
  if (other) return `${other} text standing in for this edition`;
  return "another edition's text standing in for this one";
}

function layerWords(layer: CitationLayer, input: CitationInput): string {
  switch (layer) {
    case 'model-code':
      return 'model code';
    case 'other-edition-or-state':
      return standInWords(input);
    case 'modelling-dataset':
      return 'as a public modelling dataset reads the rule';
    case 'not-checked':
      return notChecked;
  }
}

/** "Table 9.6.1" stays as it is; a bare section number reads "Section 9.4.1.1(e)". */
function referenceWords(reference: string): string {
  const trimmed = reference.trim();
  if (trimmed === '' || trimmed === 'none') return '';
  return /^(Table|Tables|Section|§)/i.test(trimmed) ? trimmed : `Section ${trimmed}`;
}

/**
 * The table a row's own source annotation names together with an edition ("From IECC-2021 Table
 * C405.3.2(2)", "ASHRAE 90.1-2022 Table 9.5.2.1-1/9.5.2.1-2"); `fallback` where it names none.
 */
export function referenceOf(note: string | null | undefined, fallback: string): string {
  const match =
    /(?:From\s+(?:ASHRAE\s+)?(?:90\.1|IECC)-?\s?\d{4}\s+|ASHRAE\s+90\.1-\d{4}\s+)(Tables?\s+[0-9A-Z][0-9A-Za-z.\-()/]*[0-9A-Za-z)])/.exec(
      note ?? '',
    );
  return match?.[1] ?? fallback;
}

/** Splits a note at " | " where it is not inside parentheses or quotes (quoted row labels use the same bar). */
function segments(note: string): string[] {
  const parts: string[] = [];
  let depth = 0;
  let quoted = false;
  let start = 0;
  for (let index = 0; index < note.length; index++) {
    const char = note[index];
    if (char === '"') quoted = !quoted;
    else if (char === '(') depth++;
    else if (char === ')') depth = Math.max(0, depth - 1);
    else if (char === '|' && depth === 0 && !quoted && note[index - 1] === ' ' && note[index + 1] === ' ') {
      parts.push(note.slice(start, index - 1));
      start = index + 2;
    }
  }
  parts.push(note.slice(start));
  return parts.map((part) => part.trim()).filter(Boolean);
}

/** Rewrites of the maintainers' shorthand, applied in order to each part of a note. */
type Rewrite = [RegExp, string | ((match: string, ...groups: string[]) => string)];

const rewrites: Rewrite[] = [
  // Links, dataset paths and pointers into the maintainers' documents: the short citation says where a value comes from in words.
  [/\s*\([^()]*(?:SOURCES\.md|shared\/reference-data|\b[\w-]+\.md\b)[^()]*\)/g, ''],
  [/\b[\w-]+\.md(?:\s*§[\d.]+)?\s+says\s+/g, ''],
  [/\s+as\s+(?:\S+\/)?[\w-]+\.md(?:\s*§[\d.]+)?\s+names it\b/g, ''],
  // "quoted … in https://…": a value read in a published article; its address stays in the files.
  [/\b(in|that) https?:\/\/[^\s,;)]+/g, '$1 a published article'],
  [/https?:\/\/[^\s,;)]+/g, ''],
  [/\s+on up\.codes\b/g, ''],
  [/\s*\(up\.codes\)/g, ''],
  [/\(\s*,\s*/g, '('],
  [/\(\s*\)/g, ''],
  // A second copy of the same data family (a modelling library's space types) confirms the transcription, not the printed code: nothing a reader acts on.
  [/\s*;?\s*\bopenstudio-standards space-type data\b[^[]*\[github:[^\]]*\]\s*/g, '; '],
  // Which snapshot or commit of a dataset was read: a later version of the same data, in words.
  [
    /^read from the public repository at that commit, not in the cloned snapshot @[0-9a-f]+; transcribed field by field$/,
    'Transcribed field by field from a later version of the public modelling dataset than the other editions use',
  ],
  [/\s*\(line read from the public repository at that commit\)/g, ''],
  [/\bread from the public repository at that commit\b/g, 'read from a later version of the public modelling dataset'],
  [/,?\s*not in the cloned snapshot @[0-9a-f]+/g, ''],
  [/\bthe newer source commit [0-9a-f]{7,40}\b/g, 'a later version of the source'],
  [/\b(?:row )?added in commit [0-9a-f]{7,40}(?: \([\d-]+\))?;\s*/g, ''],
  [
    /\bthe low-authority (?:\S*\/)?[\w.-]+\.(?:csv|json) value(?: \(unidentified [^)]*\))?/g,
    'the value of a low-authority copy of unknown origin',
  ],
  [/\s*\(github:[^\s()]+\)/g, ''],
  [/github:[^\s);,]+/g, 'public modelling code'],
  [/(?:\.\.\/|\b[\w-]+\/)*\b[\w-]+(?:\.[\w-]+)*\.(?:csv|json)\b/g, 'a transcribed table'],
  [/\s*@[0-9a-f]{7,40}\b/g, ''],
  [/\s*\(revised in BESD PR #\d+\)/g, ''],
  [/\bBESD PR #\d+\b/g, 'a public modelling dataset'],
  [/\s*\(source annotation "[^"]*"\)/g, ''],
  [/\(BESD annotations?(?: "[^"]*"(?: and "[^"]*")?)?/g, '(as the public transcription cites it'],
  [/\bBESD annotation "From ([^"]*)"/g, 'the public transcription cites $1'],
  [/the BESD row/g, 'the public modelling dataset’s row'],
  [/\bBESD\b/g, 'the public modelling dataset'],
  [/the PNNL rule-checking code/g, 'public rule-checking code'],
  [/\bPNNL rule-checking documentation\b/g, 'public rule-checking documentation'],
  [/\bthe ConStrain documentation\b/g, 'the public rule-checking documentation'],
  [/\bConStrain\b/g, 'public rule-checking'],
  [
    /PNNL's Appendix G modelling flag manon_or_partauto/g,
    'a public modelling dataset’s Appendix G flag for manual-on or partial automatic-on',
  ],
  [/\(row ([^()|]+?) \| ([^()]+?) \| flag=1\)/g, '(its row “$1, $2” is flagged)'],
  [/\bflag=1\b/g, 'flagged'],
  [/^openstudio-standards CSV annotation:\s*/i, 'A public modelling dataset notes: '],
  [/\b(?:the |an? )?older openstudio-standards (?:data|file)\b/g, 'an older public modelling library'],
  [/\bopenstudio-standards (\S+) data\b/g, 'a public modelling library’s $1 data'],
  [/\bopenstudio-standards\b/gi, 'a public modelling library'],
  [/^source annotation:\s*From\s+/i, 'The public transcription cites '],
  [/^source annotates this row/i, 'The public transcription gives this row as'],
  // The maintainers' capitals: a flag is a doubt to check, a formula row an allowance per foot of height.
  [/(^|[.;]\s+)FLAG LOW:\s*/g, '$1To verify (low confidence): '],
  [/(^|[.;]\s+)FLAG:\s*/g, '$1To verify: '],
  [/^ADDED ROW:\s*/, 'Added row: '],
  [
    /^FORMULA ROW: source unit (?:is )?W\/ft(?:;|\s+—)\s*([\d.]+) is W\/ft2 per ft of total (\w+) height, not a flat W\/ft2$/,
    (_match: string, perFoot: string, space: string) =>
      `The allowance is ${perFoot} W/ft² for each foot of the ${space}’s total height, not a flat W/ft² (the source gives the unit as W/ft)`,
  ],
  [
    /^FORMULA ROW: source gives ([\d.]+) (?:\(W\/ft2\)|with unit (W\/ft2?)) plus supplemental ([\d.]+) \(W\/ft\); read as ([\d.]+) W\/ft2 \+ ([\d.]+) W\/ft2 per ft of total (\w+) height\.?(?:\s*lpd_w_ft2 holds only the base term\.?)?/,
    (
      _match: string,
      sourceBase: string,
      sourceUnit: string | undefined,
      sourcePerFoot: string,
      base: string,
      perFoot: string,
      space: string,
    ) =>
      `The allowance is ${base} W/ft² plus ${perFoot} W/ft² for each foot of the ${space}’s total height (the source gives ${sourceBase}${sourceUnit ? ` with the unit ${sourceUnit}` : ''} and a supplemental ${sourcePerFoot} per foot).`,
  ],
  [/^FORMULA ROW:\s*/, 'The allowance depends on the height: '],
  [/\blpd_w_ft2\b/g, 'the table value'],
  [/^Tables? [^,]+ column, /, 'From the control columns of '],
  [
    /^(equal to|DIFFERS from) (ASHRAE 90\.1-\d{4}) row "([^"|]+?) \| ([^"]+?)\s*" = ([\d.]+)$/,
    (_match: string, relation: string, edition: string, type: string, part: string, value: string) =>
      `${relation === 'equal to' ? 'The same value as' : 'Differs from'} the ${edition} row “${type.trim()} — ${part.trim()}” (${value})`,
  ],
  [/^SOURCES\.md "Rows to verify":\s*/, 'To verify: '],
  [
    /^interpretation — verify: YES \(b\/c ADD1 likely\), from/,
    'An interpretation to verify: likely required (column (b) or (c), at least one of group ADD1), from',
  ],
  [/modelling proxy: NO_PROXY \(no matching Table G3\.7 row in the source\)/g, 'no modelling proxy either (no matching Table G3.7 row)'],
  [/modelling proxy: NO \(b and c likely blank\)/g, 'the modelling proxy reads it as not required (columns (b) and (c) likely blank)'],
  // "Of the same repo", "(equal; same repo)": the same dataset, which a bare "(same repo)" only repeats.
  [/\s*\(same (?:source )?repo\)/g, ''],
  [/;\s*same (?:source )?repo\)/g, ')'],
  [/\bsame (?:source )?repo\b/g, 'same dataset'],
  // Rows of another edition named in a comparison ("vs ASHRAE 90.1-2016: equal to row "Atrium | > 40 ft" = 0.4").
  [/^vs ((?:ASHRAE )?90\.1-\d{4}|IECC \d{4}):\s*/, 'Compared with $1: '],
  [
    /\b(IECC \d{4}|(?:ASHRAE )?90\.1-\d{4}) row "([^"|]+?) \| ([^"]+?)\s*" = ([\d.]+) \((equal|differs|DIFFERS)(?:; ([^)]*))?\)/g,
    (_match: string, edition: string, type: string, part: string, value: string, relation: string, more: string | undefined) =>
      `the ${edition} row “${type.trim()} — ${part.trim()}” ${relation === 'equal' ? 'has the same value' : 'differs'} (${[value, more].filter(Boolean).join('; ')})`,
  ],
  [
    /\brow "([^"|]+?) \| ([^"]+?)\s*" = ([\d.]+)/g,
    (_match: string, type: string, part: string, value: string) => `the row “${type.trim()} — ${part.trim()}” (${value})`,
  ],
  [/\bNOT\b/g, 'not'],
  [/\bDIFFERS?\b/g, (word: string) => word.toLowerCase()],
  [/\bREQ\b/g, 'required'],
  [/\brcr_threshold\b/g, 'RCR threshold'],
  [/\s*\(same lineage\)/g, ''],
  [/\s->\s/g, ' → '],
  [/\s*\(separate file\)/g, ''],
  [/\bWA\b/g, 'Washington'],
  // Provenance tags: a tag with a detail keeps the detail in words, a bare tag goes.
  [/\[(?:S|S-ed|I|M),\s*([^\]]+)\]/g, '($1)'],
  [/\s*\[(?:S|S-ed|I|M)\]\s*/g, ' '],
  // The prefix says it is not checked; a bare "[from memory, unverified]" at the end would say it twice.
  [/^(from memory:.*?)\s*\[from memory(?:, (?:unverified|uncertain))?\]$/i, '$1'],
  // "[from memory, unverified; may not exist …]": the words after the semicolon are the doubt to check.
  [/\[from memory(?:, unverified)?;\s*([^\]]+)\]/gi, '($1)'],
  [/\s*\[from memory(?:, unverified)?\](?=\))/gi, `, ${notChecked}`],
  [/\[from memory[^\]]*\]/gi, `(${notChecked})`],
  [/^from memory:\s*/i, `Not yet checked against the printed code: `],
  [/\(from memory\)/gi, `(${notChecked})`],
  [/\bfrom memory\b/gi, notChecked],
  // What the rewrites above leave between clauses.
  [/\s*;\s*(?:;\s*)+/g, '; '],
  [/^\s*;\s*|\s*;\s*$/g, ''],
];

/** Parts that only trace a row through other datasets or the files' history: nothing a reader acts on. */
const droppedParts = [
  /^(LPD )?equal in github:/,
  /^values identical to github:/,
  /^source history:/,
  /^[a-z]+[A-Z]\w* \[(?:S|S-ed|I|M)\]/,
  // An older copy of a modelling library: the same values, a missing line, or numbers that were not used.
  /^(?:an? |no line in the )?older openstudio-standards (?:data|file)\b/i,
];

function sentence(part: string): string {
  const trimmed = part
    .replace(/\s{2,}/g, ' ')
    .replace(/\s+([,;.:)])/g, '$1')
    .trim();
  if (trimmed === '') return '';
  const capital = trimmed[0]!.toUpperCase() + trimmed.slice(1);
  return /[.!?]["”)]?$/.test(capital) ? capital : `${capital}.`;
}

/**
 * A row's note (and its from-memory text) in words: no provenance tags, "FLAG:", "FORMULA ROW:",
 * "source annotation:", pointers to the maintainers' documents, dataset paths, commits or links;
 * "from memory" reads "not yet checked against the printed code". Null when nothing is left to say.
 */
export function cleanNote(note: string | null | undefined, fromMemory?: string | null): string | null {
  const raw = [...segments(note ?? '')];
  if (fromMemory?.trim()) raw.push(`from memory: ${fromMemory.trim().replace(/^\[M\]\s*/, '')}`);
  // A part that flags the value, or ends by asking to verify it, already says what a "rows to verify" pointer repeats.
  const flagged = raw.some(
    (part) => /(?:^|[.;]\s+)FLAG\b/.test(part) || (!part.startsWith('SOURCES.md') && /[;:]\s*verify\.?$/.test(part)),
  );
  const parts: string[] = [];
  for (const part of raw) {
    if (flagged && part.startsWith('SOURCES.md')) continue;
    if (droppedParts.some((pattern) => pattern.test(part))) continue;
    let text = part;
    for (const [pattern, replacement] of rewrites)
      text = typeof replacement === 'string' ? text.replace(pattern, replacement) : text.replace(pattern, replacement);
    const words = sentence(text);
    if (words !== '' && !parts.includes(words)) parts.push(words);
  }
  return parts.length === 0 ? null : parts.join(' ');
}

/**
 * A table's own text (a label or a definition) without the provenance the files append to it in
 * brackets ("[from memory, unverified; …]"): the row's citation says that, in words.
 */
export function withoutProvenance(text: string): string {
  return text.replace(/\s*\[(?:from memory|S|S-ed|I|M)\b[^\]]*\]/gi, '').trim();
}

/** The citation of one row, from its edition, its table or section and its provenance. */
export function citationOf(input: CitationInput): Citation {
  const layer = layerOf(input);
  const where = [input.edition, referenceWords(input.reference)].filter(Boolean).join(' ');
  return {
    short: `${where} — ${layerWords(layer, input)}`,
    layer,
    checked: input.verified && layer !== 'not-checked',
    note: cleanNote(input.note, input.fromMemory),
  };
}
