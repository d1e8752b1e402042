/**
 * "1 planting", "2 plantings", "1,250 problems": a count with the right form of its noun, for the
 * app's English wording (Intl.PluralRules picks the form; the number is grouped for reading).
 * Client and server both word counts through this one function.
 */
const rules = new Intl.PluralRules('en');
const number = new Intl.NumberFormat('en');

export function countOf(n: number, one: string, other = `${one}s`): string {
  return `${number.format(n)} ${rules.select(n) === 'one' ? one : other}`;
}
