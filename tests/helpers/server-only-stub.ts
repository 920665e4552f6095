// vitest runs server modules outside Next's bundler; the real `server-only` throws there.
export {};
