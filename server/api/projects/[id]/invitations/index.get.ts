// Owners see the invitations that are still open (expired ones are marked, so they can be revoked or re-sent).
export default defineEventHandler(async (event) => {
  const { project } = await requireProjectRole(event, routeId(event), 'owner')
  return listOpenInvitations(project.id)
})
