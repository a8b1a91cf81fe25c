/** The `kind` every floorcast surrogate model file carries. */
export const MODEL_FILE_KIND = "floorcast.surrogate";

/** The model file format version this build writes; it reads this version and refuses newer ones. */
export const MODEL_FORMAT_VERSION = 1;
