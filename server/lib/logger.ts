type Level = 'error' | 'warn' | 'info' | 'debug';
const order: Record<Level | 'silent', number> = { silent: 0, error: 1, warn: 2, info: 3, debug: 4 };

export interface Logger {
  error(msg: string, fields?: Record<string, unknown>): void;
  warn(msg: string, fields?: Record<string, unknown>): void;
  info(msg: string, fields?: Record<string, unknown>): void;
  debug(msg: string, fields?: Record<string, unknown>): void;
}

/** Where finished lines go: by default errors and warnings to stderr, the rest to stdout. */
export type LogSink = (level: Level, line: string) => void;

const processSink: LogSink = (lvl, line) => (lvl === 'error' || lvl === 'warn' ? process.stderr : process.stdout).write(line + '\n');

/** One JSON line per event so logs stay greppable; secrets are never passed in. */
export function createLogger(level: Level | 'silent', sink: LogSink = processSink): Logger {
  const write = (lvl: Level) => (msg: string, fields: Record<string, unknown> = {}) => {
    if (order[lvl] > order[level]) return;
    sink(lvl, JSON.stringify({ time: new Date().toISOString(), level: lvl, msg, ...fields }));
  };
  return { error: write('error'), warn: write('warn'), info: write('info'), debug: write('debug') };
}

/** A logger that keeps every line exactly as it would be written, so tests can read what a log holds. */
export function createCapturingLogger(level: Level = 'debug') {
  const lines: string[] = [];
  return { logger: createLogger(level, (_lvl, line) => lines.push(line)), lines };
}
