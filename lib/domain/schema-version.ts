/** The version of the domain's document formats (instance, bundle, award, explanations); bumped on a breaking change. */
export const schemaVersion = 1;
