/** Bumped whenever a change in lib/ can change a number in a result. Frozen into every revision. */
export const ENGINE_VERSION = '0.1.0'
