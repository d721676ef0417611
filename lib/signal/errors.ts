/**
 * The one error type of the signal core for bad input. `line` and `column` are 1-based positions in the
 * source file when the problem has one; `message` alone reads well on one line.
 */
export class SignalInputError extends Error {
  readonly line: number | null;
  readonly column: number | null;
  readonly code: string;

  constructor(code: string, message: string, where: { line?: number | null; column?: number | null } = {}) {
    const line = where.line ?? null;
    const column = where.column ?? null;
    const at = line != null ? `line ${line}${column != null ? `, column ${column}` : ''}: ` : '';
    super(`${at}${message}`);
    this.name = 'SignalInputError';
    this.code = code;
    this.line = line;
    this.column = column;
  }
}
