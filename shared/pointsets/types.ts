// Point sets: the stored form of one phase-space point and the upload report.
// Legs are all outgoing (CONVENTIONS.md "Momenta and spinors"); a momentum is [E, px, py, pz].
import type { Momentum } from '../physics/kinematics'

export type { Momentum }
export type WireC = [number, number]
export type WireSpinor = [WireC, WireC]

/** One point as stored in tables.points.data: real momenta or complex spinors, never both. */
export interface PointData {
  momenta?: Momentum[]
  lambda?: WireSpinor[]
  lambdaTilde?: WireSpinor[]
  /** Particle codes per leg as written in an event file (IDUP); legs that came in keep their code. */
  codes?: number[]
  /** The point's name in the uploaded file (CSV point id, event number). */
  label?: string
  /** The event weight XWGTUP of an event file. */
  weight?: number
  /** min |s_ij| / max |s_ij| over pairs i < j, computed on upload. */
  minInvariant?: number
}

/** A point the upload refused: which one, why, and how large the violation is (relative). */
export interface Rejection {
  point: string
  reason: string
  size: number | null
}

export type UploadFormat = 'csv' | 'json' | 'lhe'

/** A file read successfully: its points, not yet validated against physics. */
export interface ParsedFile {
  format: UploadFormat
  points: PointData[]
  /** Points the reader already refused (a duplicated leg, a wrong particle count, …). */
  rejected: Rejection[]
  meta: Record<string, unknown>
}

/** Per upload at most this many points and this many bytes. */
export const MAX_POINTS = 10_000
/** Legs per point in a file (the upload's `n` has the same ceiling). */
export const MAX_LEGS = 64
export const MAX_BYTES = 10 * 1024 * 1024

/** A point set as the API returns it. */
export interface PointSetView {
  id: number
  projectId: number
  name: string
  source: 'csv' | 'json' | 'lhe' | 'physical' | 'random'
  n: number
  count: number
  seed: number | null
  energy: number | null
  /** `mixed`: a JSON upload with both kinds of points. */
  kinematics: 'momenta' | 'spinors' | 'mixed'
  meta: Record<string, unknown>
  createdBy: number
  createdAt: string | Date
}

/** The answer of an upload. */
export interface UploadResponse {
  pointSet: PointSetView
  report: { format: UploadFormat, read: number, stored: number, rejectedCount: number, rejected: Rejection[] }
}

/** Progress of a batch check (SSE `progress`/`end` events and GET /api/batch-checks/:id). */
export interface BatchProgressView {
  id: number
  status: 'queued' | 'running' | 'done' | 'failed' | 'cancelled'
  done: number
  total: number
  rate: number | null
  etaSeconds: number | null
  elapsedMs: number | null
  counts: Record<string, number>
  message?: string
}

/** A batch check as the lists show it. */
export interface BatchCheckItem {
  id: number
  status: string
  verdict: string | null
  done: number
  total: number
  createdAt: string
  request: { process?: { theory: string, helicities: number[], shift?: number[] }, pointSetName?: string }
}
