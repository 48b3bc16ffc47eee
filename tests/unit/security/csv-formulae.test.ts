// Every CSV the app writes neutralises spreadsheet formulas (OWASP ASVS 4.0 V5.3.x output encoding:
// the "CSV injection" rule — a cell starting with = + - @ tab or CR gets a leading apostrophe).
import { describe, expect, it } from 'vitest'
import { neutraliseCell } from '#shared/csv-safe'
import { toCsv } from '#shared/pointsets/csv'

describe('V5.3.x CSV exports carry no spreadsheet formulas', () => {
  it.each(['=HYPERLINK("http://x.example","y")', '+1+2', '@SUM(A1:A2)', '-2+3+cmd|x', '\tx', '\r=1'])('neutralises %j', (s) => {
    expect(neutraliseCell(s)).toBe(`'${s}`)
  })
  it.each(['-1.5', '+2e-3', '-1/3', '0.25', 'plain label', ''])('leaves %j alone', (s) => {
    expect(neutraliseCell(s)).toBe(s)
  })
  it('the point-set CSV writer escapes labels and keeps negative momenta numeric', () => {
    const csv = toCsv([{ idx: 0, data: { label: '=HYPERLINK("http://evil.example")', momenta: [[1, 0, 0, -1], [1, 0, 0, 1]] } }])
    expect(csv).toContain(`"'=HYPERLINK(""http://evil.example"")"`)
    expect(csv).toContain(',-1')
    expect(csv.split('\n').some(line => /(^|,)[=+@]/.test(line))).toBe(false)
  })
})
