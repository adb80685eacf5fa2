/** Advisory lock keys (arbitrary fixed numbers) shared by the writers that must not interleave. */

/** Everything that adds to or renumbers the carrier's crew list: CSV and JSON imports. */
export const CREW_LIST_LOCK = 820_417_001;
