export const ENGINE_VERSION = '1.0.0';
