// What both sides say when the database cannot be reached: the API's 503 answer, the sign-in forms and the
// pages' error state.

export const DATA_STORE_UNAVAILABLE_CODE = "data_store_unavailable";

export const DATA_STORE_UNAVAILABLE_MESSAGE = "The data store is unavailable right now, so nothing was changed. Try again in a few seconds.";

/** Seconds a client is told to wait (Retry-After) before it tries again. */
export const DATA_STORE_RETRY_AFTER_S = 5;

/** The digest a page's error carries when the data store is unavailable (src/app/error.tsx shows that state). */
export const DATA_STORE_UNAVAILABLE_DIGEST = "kb-data-store-unavailable";
