import type { MigrationInterface, QueryRunner } from 'typeorm'

/**
 * Composite indexes for the parts search (GET /api/parts) at 50,000 parts. Each leads with the
 * column a query shape filters by exactly, then the ranges it narrows by, and ends with
 * archived and code so that filtering, counting and ordering by code read only the index.
 * Hand-written (not generated) so that it holds only this change; mirrored by @Index on Part.
 */
export class PartSearchIndexes1796182912313 implements MigrationInterface {
  name = 'PartSearchIndexes1796182912313'

  public async up(queryRunner: QueryRunner): Promise<void> {
    // "7ba nut", "m3 x 12 stainless", "1/4 nut": thread (or thread size range), type, length, material.
    await queryRunner.query('CREATE INDEX "IDX_parts_search_thread" ON "parts" ("threadKey", "form", "lengthMm", "material", "archived", "code")')
    // "3/8 round bms", "studd": type or section, then material and size.
    await queryRunner.query('CREATE INDEX "IDX_parts_search_form" ON "parts" ("form", "material", "sizeMm", "lengthMm", "archived", "code")')
    // "gasket 0.4", "thread locker": kind, then size (gasket thickness) and material.
    await queryRunner.query('CREATE INDEX "IDX_parts_search_kind" ON "parts" ("kind", "sizeMm", "material", "archived", "code")')
    // "bras", "gm casting": material alone, then size.
    await queryRunner.query('CREATE INDEX "IDX_parts_search_material" ON "parts" ("material", "sizeMm", "archived", "code")')
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    for (const name of ['material', 'kind', 'form', 'thread']) await queryRunner.query(`DROP INDEX "IDX_parts_search_${name}"`)
  }
}
