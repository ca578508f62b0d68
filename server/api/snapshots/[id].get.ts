import { serializeSnapshotPreview } from '../../models'

// One snapshot with its full content (settings and elements), for previews.
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, UuidParams)
  const { snapshot } = await requireMember(event, { snapshotId: id }, 'reviewer')
  const { User } = await useModels()
  const author = snapshot!.authorId ? await User.findByPk(snapshot!.authorId, { attributes: ['id', 'name'] }) : null
  return serializeSnapshotPreview(snapshot!, author)
})
