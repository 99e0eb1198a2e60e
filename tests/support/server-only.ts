// Stands in for the 'server-only' marker module outside Next's bundler.
export {};
