/**
 * A number typed by a person: "2,849.78", "2849.78", "-3.5", " 12 ". Thousands separators are accepted only in
 * groups of three ("1,2345" is refused: a mistyped decimal point more likely than a number). Exponents are not
 * accepted ("1e12" is a typo in a field form). Returns NaN for empty text, and the text itself (a string) when it
 * is not a number, so a schema says "not a number" rather than "required".
 */
export function readTypedNumber(text: unknown): number | string {
  if (typeof text === 'number') return text;
  if (typeof text !== 'string') return NaN;
  const trimmed = text.trim();
  if (trimmed === '') return NaN;
  if (!/^[-+]?(\d{1,3}(,\d{3})+|\d+)?(\.\d+)?$/.test(trimmed) || !/\d/.test(trimmed)) return trimmed;
  return Number(trimmed.replaceAll(',', ''));
}
