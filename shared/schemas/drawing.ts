// The `drawing` field of a check's result (POST /api/diagrams/:id/checks, GET /api/checks/:id) when
// the diagram's graph has drawn terms: the drawn residue sum, each drawn term, and the comparison
// with the process's full recursion under the same shift. The API page documents it from here and
// the API test parses every answer with it.
import { z } from 'zod'

const Wire = z.union([z.tuple([z.number(), z.number()]), z.tuple([z.string(), z.string()])])

const ChannelRefSchema = z.object({
  left: z.array(z.number().int()).describe('sorted leg labels on the side of the shifted leg i'),
  helicity: z.number().describe('internal helicity at leg i\'s side (a term\'s `helicity`)'),
  terms: z.array(z.string()).describe('ids of the drawn terms concerned (components; empty for a missing channel)'),
  message: z.string().describe('in words, e.g. "channel {1,6} with internal helicity − is not drawn"'),
})

export const DrawnTermSchema = z.object({
  id: z.string().describe('the drawn term: the id of its first vertex or Block (one connected component of the canvas)'),
  channel: z.array(z.number().int()).nullable().describe('sorted labels on the side of leg i of its top-level Line; null when no Line separates a channel of the shift'),
  internalHelicity: z.number().nullable().describe('helicity of the top-level Line at leg i\'s side'),
  label: z.string().nullable().describe('"{1,6} | −", as the canvas labels the term'),
  lineId: z.string().nullable().describe('the edge id of the top-level Line'),
  zStar: Wire.nullable().describe('z* of the channel'),
  pole: Wire.nullable().describe('P² at z = 0'),
  value: Wire.nullable().describe('A_L · A_R / P² of what is drawn (Blocks as sub-amplitudes, vertices as three-point amplitudes at the shifted kinematics); null when it cannot be read or meets a singular point'),
  problems: z.array(z.string()).describe('what is wrong with this term, in words (empty: well-formed)'),
})

export const DrawingComparisonSchema = z.object({
  missing: z.array(ChannelRefSchema).describe('terms of the recursion that are not drawn'),
  duplicated: z.array(ChannelRefSchema).describe('terms drawn more than once (or whose expansion covers a sub-term twice)'),
  foreign: z.array(ChannelRefSchema).describe('drawn terms that are not terms of this shift (a channel whose term vanishes)'),
  wrongHelicity: z.array(ChannelRefSchema).describe('channels drawn with the internal helicity the wrong way round'),
  incomplete: z.array(ChannelRefSchema).describe('channels whose expanded sub-amplitudes miss some of their own terms'),
  invalid: z.array(z.object({ term: z.string(), message: z.string() })).describe('drawn terms that cannot be read as a channel term (both shifted legs on one vertex, no Line separating a channel, a vertex of the wrong kind, …)'),
  messages: z.array(z.string()).describe('all of the above in words, missing terms first'),
  complete: z.boolean().describe('every term of the recursion drawn exactly once and nothing else'),
})

export const DrawingResultSchema = z.object({
  sum: Wire.nullable().describe('the drawn residue sum (also the result\'s `value`)'),
  terms: z.array(DrawnTermSchema),
  comparison: DrawingComparisonSchema,
  recursion: z.object({
    value: Wire.nullable(),
    deviation: z.number().nullable(),
    verdict: z.string(),
  }).describe('the process\'s full recursion under the same shift, as a check without a drawing reports it'),
  message: z.string().describe('one sentence: what the verdict rests on'),
})
