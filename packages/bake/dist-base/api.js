/** The public types of the async API (Baker in bake.ts). */
export {};
//# sourceMappingURL=api.js.map