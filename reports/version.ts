/** Bumped whenever a template or report component changes what a package shows. Frozen into every revision. */
export const TEMPLATE_VERSION = '4'
