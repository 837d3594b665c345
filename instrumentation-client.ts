import { config } from 'zod'

/**
 * Runs in the browser before the app's code. Zod probes `new Function('')` once to decide whether
 * it may compile fast parsers; under our CSP (no 'unsafe-eval', proxy.ts) the probe is refused —
 * harmlessly, but the browser reports a CSP violation. jitless skips the probe.
 */
config({ jitless: true })
