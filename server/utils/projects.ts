import { and, asc, eq } from 'drizzle-orm'
import { pruneDeep } from '#shared/schemas/json-bounds'
import type { ProjectRole } from '#shared/types/db'
import type { Graph, GraphView } from '#shared/schemas/graph'

export function projectView(project: typeof tables.projects.$inferSelect, role: ProjectRole) {
  return {
    id: project.id,
    name: project.name,
    description: project.description,
    role,
    createdBy: project.createdBy,
    createdAt: project.createdAt,
    updatedAt: project.updatedAt,
  }
}

/** A stored graph as sent to the editor: values nested too deep to render are cut (the row is kept). */
function openableGraph(graph: Graph): { graph: GraphView, warnings?: string[] } {
  const { value, cut } = pruneDeep(graph)
  // pruneDeep cuts only below the nesting limit: the graph's shape above it stays.
  return cut.length ? { graph: value as Graph, warnings: cut.map(path => `graph.${path}: nested too deep to open; cut from this view (saving replaces it)`) } : { graph }
}

export function diagramView(d: typeof tables.diagrams.$inferSelect) {
  return {
    id: d.id,
    projectId: d.projectId,
    title: d.title,
    ...openableGraph(d.graph),
    version: d.version,
    createdBy: d.createdBy,
    updatedBy: d.updatedBy,
    createdAt: d.createdAt,
    updatedAt: d.updatedAt,
  }
}

export async function listMembers(projectId: number) {
  return useDB().select({
    userId: tables.users.id,
    email: tables.users.email,
    name: tables.users.name,
    role: tables.memberships.role,
    since: tables.memberships.createdAt,
  })
    .from(tables.memberships)
    .innerJoin(tables.users, eq(tables.users.id, tables.memberships.userId))
    .where(eq(tables.memberships.projectId, projectId))
    .orderBy(asc(tables.users.name))
}

export async function ownerCount(projectId: number) {
  const rows = await useDB().select({ id: tables.memberships.userId }).from(tables.memberships)
    .where(and(eq(tables.memberships.projectId, projectId), eq(tables.memberships.role, 'owner')))
  return rows.length
}
