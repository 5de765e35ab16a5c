// The names a config chooses from (layer roles, hazards, length units), apart from the schema so that the page's
// form can list them without loading the validator.

/** The roles a layer can play. */
export const LAYER_ROLES = ['heads', 'pipes', 'walls', 'designArea', 'source', 'zones'] as const;
export type LayerRole = (typeof LAYER_ROLES)[number];

export const HAZARDS = ['LH', 'OH1', 'OH2', 'EH1', 'EH2'] as const;
export type Hazard = (typeof HAZARDS)[number];

export const LENGTH_UNITS = ['in', 'ft', 'mm', 'cm', 'm'] as const;
export type LengthUnit = (typeof LENGTH_UNITS)[number];
