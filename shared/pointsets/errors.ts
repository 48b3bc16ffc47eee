// A file that cannot be read at all: refused whole, with the line and column of the problem.
export class PointFileError extends Error {
  readonly status = 400
  readonly field: string
  constructor(
    public readonly line: number | null,
    public readonly column: number | null,
    public readonly reason: string,
    field = 'file',
  ) {
    const where = line === null ? '' : column === null ? `line ${line}: ` : `line ${line}, column ${column}: `
    super(`${field}: ${where}${reason}`)
    this.field = field
    this.name = 'PointFileError'
  }
}

/** 1-based line and column of a character offset. */
export function lineColumn(text: string, offset: number): { line: number, column: number } {
  let line = 1
  let start = 0
  const end = Math.min(offset, text.length)
  for (let i = 0; i < end; i++) {
    if (text.charCodeAt(i) === 10) {
      line++
      start = i + 1
    }
  }
  return { line, column: end - start + 1 }
}

/** Thrown when a file holds more points than one point set may. */
export class TooManyPointsError extends Error {
  constructor(public readonly count: number, public readonly limit: number) {
    super(`file: holds more than ${limit.toLocaleString('en-US')} points (the limit per point set)`)
    this.name = 'TooManyPointsError'
  }
}
