// The drawing compiler: a canvas's drawn terms read as a residue sum (structure.ts), compared with
// the process's recursion (compare.ts) and evaluated at a point (evaluate.ts).
//
// For the editor: `validateGraph(nodes, edges, process).drawing` (the store's `validation.drawing`)
// holds one DrawnTerm per component — `label` ("{1,6} | −"), `channel`, `lineId` (the top-level
// Line), `leftNodeIds` / `rightNodeIds`, `valid`, `problems` — and its node and edge messages are
// merged into `validation.nodes` / `validation.edges`. For the server: `checkDrawing(response,
// process, graph)` → the response with `drawing` (shared/schemas/drawing.ts), used by the check route.
export * from './structure'
export * from './compare'
export * from './evaluate'
export * from './handoff'
