/**
 * The library's sources carry the engineers' provenance marks (a section of the science notes, a
 * figure recalled rather than read). Growers see the same honesty in plain words: where a figure
 * is not from a published table, the wording says so, without the internal marks.
 */
const RULES: Array<[RegExp, string]> = [
  [/^Common practice \(from memory, no source read\)$/i, 'Common growing practice; not checked against a published table'],
  [/^common practice, no source\b/i, 'Common growing practice, not from a published table'],
  [/\bis common practice, no source\b/gi, 'is common growing practice, not from a published table'],
  [/\s*\(SCIENCE §\d+(?:,\s*[HML])?\)/g, ''],
  [/\bSCIENCE §\d+:\s*/g, ''],
  [/\s*\((?:[HML])\)/g, ''],
  [/\s*\(from memory\)/gi, ' (a commonly given figure, not checked against a published table)'],
  [/;?\s*class from memory/gi, '; class as commonly given, not checked against a published table'],
  [/\bfrom memory\b/gi, 'as commonly given'],
];

export function sourceInPlainWords(source: string): string {
  let out = source;
  for (const [pattern, words] of RULES) out = out.replace(pattern, words);
  return out.replace(/\s{2,}/g, ' ').trim();
}
