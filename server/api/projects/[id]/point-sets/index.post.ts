// Upload of a point file (multipart: file, and optionally name, format, n). Valid points are stored
// in one transaction; the response reports the refused ones (point, reason, size of the violation).
export default defineEventHandler(async (event) => {
  const { project, user } = await requireProjectRole(event, routeId(event), 'editor')
  const upload = await readPointUpload(event)
  const result = await checkUpload(upload.text, upload.filename, upload.format, upload.n)
  const name = upload.name ?? result.name ?? (upload.filename || `Uploaded ${result.format.toUpperCase()} points`)
  const set = await storePointSet({
    projectId: project.id, userId: user.id, name, source: result.format, n: result.n,
    meta: { ...result.meta, filename: upload.filename, read: result.read, rejected: result.rejected.length },
    points: result.valid,
  })
  await audit(project.id, user.id, 'pointset.upload', 'point-set', set.id, { name: set.name, count: set.count, rejected: result.rejected.length })
  setResponseStatus(event, 201)
  return {
    pointSet: pointSetView(set),
    report: { format: result.format, read: result.read, stored: set.count, rejectedCount: result.rejected.length, rejected: result.rejected.slice(0, 1000) },
  }
})
