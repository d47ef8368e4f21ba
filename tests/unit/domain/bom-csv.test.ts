import { describe, expect, it } from 'vitest'
import { parseBomText, readQuantity } from '../../../shared/domain/bom-csv'

describe('reading BOM lines from CSV or pasted text', () => {
  it('reads a CSV with a header, in any column order, and numbers rows by their line in the file', () => {
    const r = parseBomText('note,quantity,code\r\ncover nuts,24,7ba-nut-br\n\nchest studs,12,6BA-STUD-20-BR\n')
    expect(r.errors).toEqual([])
    expect(r.rows).toEqual([
      { line: 2, code: '7BA-NUT-BR', quantity: 24, pieces: 1, note: 'cover nuts' },
      { line: 4, code: '6BA-STUD-20-BR', quantity: 12, pieces: 1, note: 'chest studs' },
    ])
  })

  it('reads headerless rows, semicolons, tabs from a spreadsheet, and plain "code quantity note" text', () => {
    expect(parseBomText('7BA-NUT-BR;24;cover nuts').rows[0]).toMatchObject({ code: '7BA-NUT-BR', quantity: 24, note: 'cover nuts' })
    expect(parseBomText('GSK-0.4\t4\tcover gaskets').rows[0]).toMatchObject({ code: 'GSK-0.4', quantity: 4, note: 'cover gaskets' })
    expect(parseBomText('7BA-NUT-BR 24 cylinder cover nuts\n# a comment\nM3-NUT 10').rows).toEqual([
      { line: 1, code: '7BA-NUT-BR', quantity: 24, pieces: 1, note: 'cylinder cover nuts' },
      { line: 3, code: 'M3-NUT', quantity: 10, pieces: 1, note: '' },
    ])
  })

  it('reads bar lines as pieces × length, or from a pieces column', () => {
    expect(parseBomText('ROUND-9.525-BR 2 x 60 cylinder blanks').rows[0]).toMatchObject({ quantity: 60, pieces: 2, note: 'cylinder blanks' })
    expect(parseBomText('code,quantity,pieces\nHEX-6.35-BR,35.5,4').rows[0]).toMatchObject({ quantity: 35.5, pieces: 4 })
    expect(readQuantity('3×40 mm')).toEqual({ quantity: 40, pieces: 3 })
    expect(readQuantity('12,5')).toEqual({ quantity: 12.5, pieces: 1 })
    expect(readQuantity('a dozen')).toBeNull()
  })

  it('names the line of each problem and keeps the good rows', () => {
    const r = parseBomText('code,quantity,pieces\nA-1,x\nB-2,\n,3\nC-3,2,0\nD-4,5')
    expect(r.rows.map((x) => x.code)).toEqual(['D-4'])
    expect(r.errors).toEqual([
      { line: 2, message: '"x" is not a quantity above 0' },
      { line: 3, message: 'the quantity for B-2 is missing' },
      { line: 4, message: 'the part code is missing' },
      { line: 5, message: '"0" is not a whole number of pieces' },
    ])
  })
})
