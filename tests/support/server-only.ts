// server-only refuses to load outside React Server Components; tests call the server modules directly.
export {};
