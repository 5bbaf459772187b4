import { CALC_LIMITS } from '../../../src/shared/schemas/calc-limits';
import type { SurfacePoints } from '../../../src/shared/domain/earthwork/surface';
import type { ApiErrorDetail } from '../../../src/shared/schemas/api-error';

const M = CALC_LIMITS.maxMagnitude;
const MAX_ISSUES = 20;

/**
 * Reads a point survey as it streams in: one shot a line, `x,y,z` (easting, northing, elevation), separated by
 * commas, semicolons, tabs or spaces; a first line that is not numeric is a header; blank lines and lines starting
 * with `#` are skipped. Points go straight into growing Float64Arrays (24 bytes a point), so a million-point file
 * never becomes a million small arrays. Bad lines are listed by line number (at most 20).
 */
export class SurveyReader {
  private decoder = new TextDecoder('utf-8', { fatal: true });
  private rest = '';
  private line = 0;
  private x = new Float64Array(1024);
  private y = new Float64Array(1024);
  private z = new Float64Array(1024);
  count = 0;
  readonly issues: ApiErrorDetail[] = [];

  constructor(private readonly field: string) {}

  push(chunk: Uint8Array): void {
    let text: string;
    try {
      text = this.decoder.decode(chunk, { stream: true });
    } catch {
      this.issue(`${this.field}`, 'The file is not UTF-8 text; save it as UTF-8 CSV (x, y, z a line).');
      return;
    }
    const lines = (this.rest + text).split('\n');
    this.rest = lines.pop()!;
    for (const l of lines) this.readLine(l);
  }

  /** The points read, once the file has ended (or null when it had problems: see `issues`). */
  end(): SurfacePoints | null {
    if (this.rest !== '') this.readLine(this.rest);
    this.rest = '';
    if (this.issues.length === 0 && this.count < 3)
      this.issue(this.field, `At least 3 points; the file has ${this.count}.`);
    if (this.issues.length > 0) return null;
    return { x: this.x.subarray(0, this.count), y: this.y.subarray(0, this.count), z: this.z.subarray(0, this.count) };
  }

  private readLine(raw: string): void {
    this.line++;
    if (this.issues.length >= MAX_ISSUES) return;
    const text = raw.trim();
    if (text === '' || text.startsWith('#')) return;
    const cells = text.split(/[,;\t ]+/);
    const values = cells.map(Number);
    if (cells.length !== 3 || values.some((v, i) => !Number.isFinite(v) || cells[i] === '')) {
      if (this.line === 1 && values.every((v) => Number.isNaN(v))) return; // a header
      this.issue(`${this.field}.line ${this.line}`, `Expected three numbers "x, y, z"; found "${text.slice(0, 80)}".`);
      return;
    }
    if (values.some((v) => Math.abs(v) > M)) {
      this.issue(`${this.field}.line ${this.line}`, `Coordinates and elevations are at most ${M} in size.`);
      return;
    }
    if (this.count === CALC_LIMITS.surfacePoints) {
      this.issue(this.field, `At most ${CALC_LIMITS.surfacePoints} points per survey.`);
      return;
    }
    if (this.count === this.x.length) this.grow();
    this.x[this.count] = values[0]!;
    this.y[this.count] = values[1]!;
    this.z[this.count] = values[2]!;
    this.count++;
  }

  private grow(): void {
    const size = Math.min(this.x.length * 2, CALC_LIMITS.surfacePoints);
    const bigger = (a: Float64Array) => {
      const b = new Float64Array(size);
      b.set(a);
      return b;
    };
    this.x = bigger(this.x);
    this.y = bigger(this.y);
    this.z = bigger(this.z);
  }

  private issue(path: string, message: string): void {
    if (this.issues.length < MAX_ISSUES) this.issues.push({ path, message });
  }
}
