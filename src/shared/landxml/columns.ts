/** A growable Float64Array (or Uint32Array) column: a million points cost 8 (4) bytes each, not an object each. */
export class FloatColumn {
  data = new Float64Array(1024);
  n = 0;
  push(v: number): void {
    if (this.n === this.data.length) {
      const next = new Float64Array(this.data.length * 2);
      next.set(this.data);
      this.data = next;
    }
    this.data[this.n++] = v;
  }
  done(): Float64Array {
    return this.data.slice(0, this.n);
  }
}

export class IndexColumn {
  data = new Uint32Array(1024);
  n = 0;
  push(v: number): void {
    if (this.n === this.data.length) {
      const next = new Uint32Array(this.data.length * 2);
      next.set(this.data);
      this.data = next;
    }
    this.data[this.n++] = v;
  }
  done(): Uint32Array {
    return this.data.slice(0, this.n);
  }
}

/** Whitespace-separated numbers of an element's text ("5000.5 2000.25 101.2"); NaN for a word that is not one. */
export function numbersOf(text: string): number[] {
  const t = text.trim();
  if (t === '') return [];
  return t.split(/\s+/).map((w) => (/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(w) ? Number(w) : NaN));
}

const isSpace = (c: number) => c === 32 || c === 10 || c === 13 || c === 9;
/** Characters a decimal number may hold: digits, sign, point, exponent. */
const isNumberChar = (c: number) => (c >= 48 && c <= 57) || c === 46 || c === 45 || c === 43 || c === 101 || c === 69;

/**
 * Whitespace-separated numbers of an element's text into `out` (no arrays, no regular expressions: a million
 * points are read without garbage). Answers how many words there were, or -1 when a word is not a decimal number
 * or there are more than `out` holds.
 */
export function scanNumbers(text: string, out: Float64Array): number {
  const n = text.length;
  let count = 0;
  let i = 0;
  while (i < n) {
    while (i < n && isSpace(text.charCodeAt(i))) i++;
    if (i >= n) break;
    const start = i;
    let ok = true;
    while (i < n && !isSpace(text.charCodeAt(i))) {
      if (!isNumberChar(text.charCodeAt(i))) ok = false;
      i++;
    }
    if (!ok || count === out.length) return -1;
    const v = Number(text.slice(start, i));
    if (!Number.isFinite(v)) return -1;
    out[count++] = v;
  }
  return count;
}

/**
 * Whitespace-separated positive whole numbers (point ids as written by most programs: 1, 2, 3...) into `out`;
 * -1 when a word is something else (the caller then reads the words as text ids).
 */
export function scanIds(text: string, out: Float64Array): number {
  const n = text.length;
  let count = 0;
  let i = 0;
  while (i < n) {
    while (i < n && isSpace(text.charCodeAt(i))) i++;
    if (i >= n) break;
    if (count === out.length) return -1;
    let v = 0;
    const start = i;
    while (i < n && !isSpace(text.charCodeAt(i))) {
      const c = text.charCodeAt(i) - 48;
      if (c < 0 || c > 9 || (i === start && c === 0)) return -1;
      v = v * 10 + c;
      i++;
    }
    out[count++] = v;
  }
  return count;
}
