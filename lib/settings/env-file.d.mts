export function readEnvFile(file?: string): Record<string, string>;
export function loadEnvFile(target?: Record<string, string | undefined>, file?: string): string[];
export function shellExports(file: string, env?: Record<string, string | undefined>): string;
