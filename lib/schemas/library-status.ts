import type { ComplexStatus } from './library';

/**
 * The library states the measured-decides rule reads, named once so a renamed workflow changes
 * one line here: an accepted entry's measurements decide; a retired entry's no longer do.
 */
export const ACCEPTED_STATUS: ComplexStatus = 'accepted';
export const RETIRED_STATUS: ComplexStatus = 'retired';
