import { In } from 'typeorm'
import { inTransaction } from '../db'
import { Part } from '../entities'
import { badRequest } from '../errors'
import { editableBuild, type Actor } from './builds-access'
import { addLineTo, lineProblem } from './builds-lines'
import { parseBomText } from '../../shared/domain/bom-csv'
import { MAX_IMPORT_LINES, importInput, type ImportInput } from '../../shared/schemas/build'
import type { BomImportResultDto, BomImportRowDto } from '../../shared/types/build'

/**
 * Adds BOM lines from CSV or pasted text. A dry run shows each row resolved against the
 * catalogue; applying adds every row in one transaction, or nothing when any row has a problem.
 */
export const importLines = (buildId: number, raw: ImportInput, actor: Actor): Promise<BomImportResultDto> =>
  inTransaction(async (tx) => {
    const input = importInput.parse(raw)
    const build = await editableBuild(tx, buildId, actor)
    const parsed = parseBomText(input.text)
    if (parsed.rows.length + parsed.errors.length > MAX_IMPORT_LINES) {
      throw badRequest('TOO_MANY_LINES', `At most ${MAX_IMPORT_LINES} lines at once.`)
    }
    const codes = [...new Set(parsed.rows.map((r) => r.code))]
    const parts = new Map((await tx.findBy(Part, { code: In(codes) })).map((p) => [p.code, p]))
    const rows: BomImportRowDto[] = parsed.rows.map((r) => {
      const part = parts.get(r.code)
      const error = !part ? `no part has the code ${r.code}`
        : part.archived ? `${part.code} is archived`
          : lineProblem(part, r.quantity, r.pieces)
      return { ...r, partId: part?.id ?? null, partName: part?.name ?? null, error }
    })
    for (const e of parsed.errors) rows.push({ line: e.line, code: '', partId: null, partName: null, quantity: 0, pieces: 1, note: '', error: e.message })
    rows.sort((a, b) => a.line - b.line)
    const bad = rows.filter((r) => r.error)
    if (input.dryRun) return { dryRun: true, rows, added: 0, applied: false }
    if (!rows.length) throw badRequest('NOTHING_TO_IMPORT', 'No lines were found in the text.')
    if (bad.length) {
      throw badRequest('BOM_IMPORT_ERRORS',
        `${bad.length} line(s) have problems; nothing was added. First: line ${bad[0].line}, ${bad[0].error}.`, rows)
    }
    for (const r of rows) await addLineTo(tx, build, { partId: r.partId!, quantity: r.quantity, pieces: r.pieces, note: r.note })
    return { dryRun: false, rows, added: rows.length, applied: true }
  })
