/** Decorators run at import time, so the binary column type follows DATABASE_URL as the process started. */
export const binaryColumnType = /^postgres(ql)?:\/\//.test(process.env.DATABASE_URL ?? '') ? 'bytea' : 'blob';
