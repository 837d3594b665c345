/** The demo scenario (invented for Inverso) lives in lib/demo; the password is only for the seeded accounts. */
export { DEMO_CALCS, DEMO_PROJECT } from '@/lib/demo/calcs'
export { DEMO_USERS } from '@/lib/demo/people'

export const DEMO_PASSWORD = 'demo-pass-2027'
