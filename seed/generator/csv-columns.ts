/** Column order shared by the CSV writer and its documentation. */
export const POSITIONS = ["captain", "first_officer", "purser", "flight_attendant"] as const;
