// The workspace parts library: list, create, change, remove, and the stock-list import, which
// writes every row in one transaction (a file is taken whole or not at all).
import type { Transaction } from 'sequelize'
import { serializePart, type PartInstance } from '../models'
import type { LibraryPart, LibraryPartRow } from '../../shared/library/part'

function columnsOf(part: LibraryPart) {
  return {
    partId: part.partId,
    kind: part.kind,
    value: part.value,
    tolerance: part.tolerance ?? null,
    vRatingV: part.vRatingV ?? null,
    iRatingA: part.iRatingA ?? null,
    q: part.q ?? null,
    model: part.model ? JSON.stringify(part.model) : null,
    measured: part.measured ? JSON.stringify(part.measured) : null,
    stocked: part.stocked,
    description: part.description ?? null,
  }
}

export async function listParts(workspaceId: number): Promise<LibraryPartRow[]> {
  const { Part } = await useModels()
  const rows = await Part.findAll({ where: { workspaceId }, order: [['kind', 'ASC'], ['value', 'ASC'], ['partId', 'ASC']] })
  return rows.map(serializePart)
}

async function findPart(workspaceId: number, partId: string, transaction?: Transaction): Promise<PartInstance | null> {
  const { Part } = await useModels()
  return Part.findOne({ where: { workspaceId, partId }, transaction })
}

/** A measured file named by a part must be an upload of the same workspace. */
async function requireUploadIn(workspaceId: number, part: LibraryPart, transaction?: Transaction): Promise<void> {
  if (!part.measured) return
  const { Upload } = await useModels()
  const upload = await Upload.findByPk(part.measured.uploadId, { transaction })
  if (!upload || upload.workspaceId !== workspaceId) {
    throw createError({ statusCode: 422, message: `measured.uploadId: no measured file ${part.measured.uploadId} in this workspace`, data: { field: 'measured.uploadId' } })
  }
}

export async function createPart(workspaceId: number, part: LibraryPart): Promise<LibraryPartRow> {
  const { Part } = await useModels()
  const sequelize = await useDb()
  return sequelize.transaction(async (transaction) => {
    if (await findPart(workspaceId, part.partId, transaction)) {
      throw createError({ statusCode: 409, message: `partId: the library already has a part ${part.partId}`, data: { field: 'partId' } })
    }
    await requireUploadIn(workspaceId, part, transaction)
    return serializePart(await Part.create({ workspaceId, ...columnsOf(part) }, { transaction }))
  })
}

/** Replaces a part's fields (its identifier may change, to one not taken). */
export async function updatePart(workspaceId: number, partId: string, part: LibraryPart): Promise<LibraryPartRow> {
  const sequelize = await useDb()
  return sequelize.transaction(async (transaction) => {
    const row = await findPart(workspaceId, partId, transaction)
    if (!row) throw createError({ statusCode: 404, message: `No part ${partId} in this library.` })
    if (part.partId !== partId && await findPart(workspaceId, part.partId, transaction)) {
      throw createError({ statusCode: 409, message: `partId: the library already has a part ${part.partId}`, data: { field: 'partId' } })
    }
    await requireUploadIn(workspaceId, part, transaction)
    await row.update(columnsOf(part), { transaction })
    return serializePart(row)
  })
}

export async function deletePart(workspaceId: number, partId: string): Promise<void> {
  const row = await findPart(workspaceId, partId)
  if (!row) throw createError({ statusCode: 404, message: `No part ${partId} in this library.` })
  await row.destroy()
}

/**
 * Writes a parsed stock list: new identifiers are added, existing ones replaced (a part's
 * measured file, which the CSV does not carry, is kept). One transaction for the whole file.
 */
export async function importParts(workspaceId: number, parts: readonly LibraryPart[]): Promise<{ created: number, updated: number }> {
  const { Part } = await useModels()
  const sequelize = await useDb()
  return sequelize.transaction(async (transaction) => {
    let created = 0
    let updated = 0
    for (const part of parts) {
      const row = await findPart(workspaceId, part.partId, transaction)
      const columns = columnsOf(part)
      if (row) {
        await row.update({ ...columns, measured: row.measured }, { transaction })
        updated++
      }
      else {
        await Part.create({ workspaceId, ...columns }, { transaction })
        created++
      }
    }
    return { created, updated }
  })
}
