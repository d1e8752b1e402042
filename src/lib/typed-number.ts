/**
 * A figure a grower typed: "1.5", "1,5" (decimal comma) and, where negative figures make sense, a
 * typographic minus ("−3"); blank → null; anything else (words, "1e3", "0x10", "2.5.1") → NaN.
 * Every form that takes a typed figure without a number input reads it through this one function.
 */
export function parseTypedNumber(text: string, { negative = false }: { negative?: boolean } = {}): number | null {
  const t = text.trim().replace(',', '.').replace('−', '-');
  if (t === '') return null;
  const shape = negative ? /^-?(\d+(\.\d+)?|\.\d+)$/ : /^(\d+(\.\d+)?|\.\d+)$/;
  return shape.test(t) ? Number(t) : Number.NaN;
}
