// Demo data: an invented research group with invented people (example.test addresses).
// Idempotent: running it twice changes nothing.
import { and, eq } from 'drizzle-orm'
import type { Graph } from '#shared/schemas/graph'
import { expandedGraph } from '#shared/editor/demo'
import type { ProjectRole } from '#shared/types/db'

export const DEMO_PASSWORD = 'polewright-demo'

export const demoPeople = [
  { email: 'ines.varga@example.test', name: 'Ines Varga', site: 'admin' as const, role: 'owner' as ProjectRole },
  { email: 'tomas.okafor@example.test', name: 'Tomas Okafor', site: 'member' as const, role: 'editor' as ProjectRole },
  { email: 'mira.holloway@example.test', name: 'Mira Holloway', site: 'member' as const, role: 'viewer' as ProjectRole },
  { email: 'kenji.albright@example.test', name: 'Kenji Albright', site: 'member' as const, role: null },
]

export const DEMO_PROJECT = 'Brackenridge amplitudes group: tree-level checks'

/**
 * Demo diagrams, laid out as the editor's Expand leaves them (the engine computes the term tree
 * here at start-up). The bad shift [3,1⟩ is [+,−⟩: its residue sum misses a boundary term.
 */
export const demoDiagrams: { title: string, graph: Graph }[] = [
  { title: 'Five gluons, MHV (−−+++) under [1,2⟩', graph: expandedGraph({ theory: 'gluon', helicities: [-1, -1, 1, 1, 1], shift: [1, 2] }, true) },
  { title: 'Six gluons, alternating (−+−+−+)', graph: expandedGraph({ theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], shift: [1, 2] }) },
  { title: 'Four gravitons: consistency test', graph: expandedGraph({ theory: 'graviton', helicities: [-2, -2, 2, 2], shift: [1, 2] }, true) },
  { title: 'Bad shift: four gluons under [+,−⟩', graph: expandedGraph({ theory: 'gluon', helicities: [-1, -1, 1, 1], shift: [3, 1] }, true) },
  { title: 'A quark line: q̄⁻ q⁺ g⁻ g⁺ under [3,1⟩', graph: expandedGraph({ theory: 'qcd', helicities: [-0.5, 0.5, -1, 1], species: ['qbar1', 'q1', 'g', 'g'], shift: [3, 1] }, true) },
]

export async function seedDemo() {
  const db = useDB()
  const passwordHash = await hashPassword(DEMO_PASSWORD)
  const ids: number[] = []
  for (const p of demoPeople) {
    await db.insert(tables.users).values({ email: p.email, name: p.name, role: p.site, passwordHash }).onConflictDoNothing()
    const row = await db.select().from(tables.users).where(eq(tables.users.email, p.email)).get()
    ids.push(row!.id)
  }
  const ownerId = ids[0]!
  let project = await db.select().from(tables.projects).where(and(eq(tables.projects.name, DEMO_PROJECT), eq(tables.projects.createdBy, ownerId))).get()
  if (!project) {
    project = await db.insert(tables.projects).values({
      name: DEMO_PROJECT,
      description: 'Shared checks of the group\'s recursion results before they go into the draft: MHV and alternating gluons, a graviton consistency test, and a cautionary bad shift.',
      createdBy: ownerId,
    }).returning().get()
    await audit(project.id, ownerId, 'project.create', 'project', project.id, { name: project.name })
  }
  for (const [i, p] of demoPeople.entries()) {
    if (p.role) await db.insert(tables.memberships).values({ projectId: project.id, userId: ids[i]!, role: p.role }).onConflictDoNothing()
  }
  for (const d of demoDiagrams) {
    const exists = await db.select({ id: tables.diagrams.id }).from(tables.diagrams)
      .where(and(eq(tables.diagrams.projectId, project.id), eq(tables.diagrams.title, d.title))).get()
    if (exists) continue
    const row = await db.insert(tables.diagrams).values({ projectId: project.id, title: d.title, graph: d.graph, createdBy: ownerId, updatedBy: ownerId }).returning().get()
    await db.insert(tables.diagramRevisions).values({ diagramId: row.id, version: 1, title: row.title, graph: row.graph, savedBy: ownerId, note: 'demo' })
  }
  // Later features add their demo data below (point sets, checks), each idempotent.
  await seedDemoPointSet(project.id, ownerId)
  await seedDemoComments(project.id, ids)
  return { projectId: project.id, userIds: ids }
}
