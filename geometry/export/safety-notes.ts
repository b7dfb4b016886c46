/**
 * The usual cautions printed on the print set and the bench card (shared/DESIGN.md, hazards list).
 * They point to the adhesive maker's safety data sheet and local rules rather than replace them.
 */
export const SAFETY_NOTES: readonly string[] = [
  'Solvent contact cement is flammable and its vapours are harmful: work with good ventilation, wear a respirator suited to the adhesive\'s vapours (organic vapour cartridges for solvent cements), keep sparks and flames away.',
  'Heat guns and hot knives: work on a heat-proof surface, keep hands clear of the nozzle, and do not overheat foam (it gives off fumes).',
  'Blades and rotary tools: cut away from your body on a cutting mat, change dull blades, wear eye protection.',
  'Follow the adhesive maker\'s safety data sheet and your local rules; they take precedence over these notes.',
];
