// The drawing compiler: a canvas's drawn terms read as a residue sum (structure.ts), compared with
// the process's recursion (compare.ts) and evaluated at a point (evaluate.ts).
export * from './structure'
export * from './compare'
export * from './evaluate'
