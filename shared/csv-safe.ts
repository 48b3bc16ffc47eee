// Spreadsheet-formula neutralisation for every CSV the app writes (the OWASP "CSV injection" rule):
// a cell starting with = + - @ tab or CR gets a leading apostrophe, so Excel/LibreOffice show it as
// text. Plain numbers (-1.5, +2e-3, exact rationals like -1/3) are left alone: they run no function.

export const CSV_FORMULA = /^(?![+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?(?:\/\d+)?$)[=+\-@\t\r]/

/** The papaparse option: `Papa.unparse(data, { escapeFormulae: CSV_FORMULA })`. */
export const csvUnparseSafe = { escapeFormulae: CSV_FORMULA, newline: '\n' } as const

export function neutraliseCell(s: string): string {
  return CSV_FORMULA.test(s) ? `'${s}` : s
}
