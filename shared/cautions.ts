/** The cautions shown on Evaluate, on design records and in the README. */
export const CAUTIONS_TEXT =
  'Results are screening estimates for qualified engineers. Windows and hulls for human occupancy must be designed, made, tested and certified to the applicable pressure-vessel standard and classification rules, and approved under local codes and licensed practice. Property data must be confirmed for the actual lot and supplier.';
