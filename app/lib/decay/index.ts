/**
 * Radioactive decay: decay constants, the fraction of a parent left, the age equation (plain and
 * branched, K–Ar) with uncertainty propagation, and the "how we know" figures for marker pages.
 * Pure TypeScript; the same code runs in the browser and on the server.
 */
export * from "./equations";
export * from "./how-we-know";
export * from "./figures";
