// Stands in for the "server-only" marker package when vitest imports server modules.
export {};
