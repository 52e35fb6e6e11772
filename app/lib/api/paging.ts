// Paging of every API list: page/limit for the small lists, a cursor for the run log (which only grows).
/** Largest page any list answers; asking for more is a 400. */
export const PAGE_LIMIT_MAX = 100;
export const PAGE_LIMIT_DEFAULT = 25;
