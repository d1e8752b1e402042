type Level = 'error' | 'warn' | 'info' | 'debug';
const order: Record<Level | 'silent', number> = { silent: 0, error: 1, warn: 2, info: 3, debug: 4 };

export interface Logger {
  error(msg: string, fields?: Record<string, unknown>): void;
  warn(msg: string, fields?: Record<string, unknown>): void;
  info(msg: string, fields?: Record<string, unknown>): void;
  debug(msg: string, fields?: Record<string, unknown>): void;
}

/** One JSON line per event so logs stay greppable; secrets are never passed in. */
export function createLogger(level: Level | 'silent'): Logger {
  const write = (lvl: Level) => (msg: string, fields: Record<string, unknown> = {}) => {
    if (order[lvl] > order[level]) return;
    const line = JSON.stringify({ time: new Date().toISOString(), level: lvl, msg, ...fields });
    (lvl === 'error' || lvl === 'warn' ? process.stderr : process.stdout).write(line + '\n');
  };
  return { error: write('error'), warn: write('warn'), info: write('info'), debug: write('debug') };
}
