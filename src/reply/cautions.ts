/**
 * Cautions: the one place their wording lives. Every reply that drives a decision carries
 * CONFIRM_PROCEDURE; method-specific hazards go with the methods that have them.
 */
export const CONFIRM_PROCEDURE =
  "Confirm against your fab's controlled procedure and the product spec before acting on this value; when in doubt, ask the area's process engineer.";

export const HOT_PROBE_HAZARD =
  'The hot probe runs at about 40–100 °C: use the heated-probe holder, keep fingers off the tip, and let it cool before handling.';

export const ELECTRICAL_HAZARD =
  'Probe current and voltage: use the instrument as qualified, keep the current in the range the procedure sets for this resistivity, and do not touch the probe pins while sourcing.';

export const HALL_HAZARD =
  'Hall set-ups use strong magnets and sourced current: follow the station procedure (no steel tools, pacemaker warning) and let qualified staff handle sample mounting.';

export const MODEL_ESTIMATE =
  'This is a model estimate, not a measurement; the controlled spec and the referee method in your procedure take precedence.';
