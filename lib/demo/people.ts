/** The demo scenario's people (invented): the seed makes them accounts, the demo packages sign with their names. */
export const DEMO_USERS = [
  { key: 'admin', email: 'admin@feldmark.example', name: 'Jonas Feld', isAdmin: true },
  { key: 'engineer', email: 'ines.vogt@feldmark.example', name: 'Ines Vogt', isAdmin: false },
  { key: 'checker', email: 'tomas.brandt@feldmark.example', name: 'Tomas Brandt', isAdmin: false },
  { key: 'approver', email: 'mara.lind@feldmark.example', name: 'Mara Lind', isAdmin: false },
] as const
