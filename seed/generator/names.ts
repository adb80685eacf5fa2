/** Invented names for generated crew: first and last names drawn independently. */
import type { Rng } from "../random.ts";

const FIRST = [
  "Ada", "Bram", "Celia", "Dario", "Elin", "Farid", "Greer", "Hollis", "Ilse", "Jonah", "Kaia", "Lorcan", "Maren", "Niko",
  "Odile", "Pim", "Quinn", "Rosalind", "Soren", "Tamsin", "Ulla", "Vikram", "Wynn", "Xiomara", "Yusuf", "Zelda", "Anouk",
  "Beto", "Cosima", "Dmitri", "Esme", "Florin", "Gaia", "Hamish", "Ines", "Joaquin", "Kenji", "Liesel", "Mateo", "Nadia",
];
const LAST = [
  "Aldana", "Brightwater", "Castellan", "Dunmore", "Eskildsen", "Fairweather", "Grimaldi", "Holloway", "Ivers", "Jankowski",
  "Kestrel", "Lindgren", "Marchetti", "Nakamura", "Oduya", "Penhallow", "Quiroga", "Rasmussen", "Sandoval", "Thorne",
  "Underhill", "Valcourt", "Wexford", "Yamada", "Zeller", "Abernethy", "Bellamy", "Corvino", "Delacroix", "Everly",
];

/** A name for the k-th generated crew member; varied, repeatable for the same random source. */
export function crewName(r: Rng): string {
  return `${r.pick(FIRST)} ${r.pick(LAST)}`;
}
