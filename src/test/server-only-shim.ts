// Vitest runs server modules outside React's server environment, where the real `server-only` throws.
export {};
