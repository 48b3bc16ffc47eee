// Particle codes of point files (PDG numbering: 21 gluon, 1..6 quarks d u s c b t, −1..−6 their
// antiquarks) against a process's species per leg. A file lists incoming particles as they come
// in; the engine takes every leg outgoing, so an incoming quark is an outgoing antiquark: a leg
// fits when its code is the species' code or its antiparticle's (a gluon is its own).
import { pdgOfSpecies } from '../physics/quarks'

/** Why a point's codes do not fit the species (wire names, one per leg), or null. */
export function speciesCodeMismatch(species: readonly string[], codes: readonly number[]): string | null {
  for (let t = 0; t < species.length; t++) {
    const want = pdgOfSpecies(species[t]!)
    const c = codes[t]
    if (c !== want && c !== -want) return `leg ${t + 1} has particle code ${c}; the process's species ${species[t]} needs code ${want}${want === 21 ? '' : ` (or ${-want} for an incoming leg)`}`
  }
  return null
}
