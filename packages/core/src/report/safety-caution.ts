/**
 * The caution every report carries (PRODUCT.md, Safety): what Leadline's positions are and are not.
 */
export const SAFETY_CAUTION =
  'Positions from acoustic systems can be wrong by metres to tens of metres, more near structures and at long range. ' +
  'This report documents where a vehicle was; it is not a navigation aid. Diving and ROV operations and survey deliverables follow local regulations, client specifications and licensed practice.';
