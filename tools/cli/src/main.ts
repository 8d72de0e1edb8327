#!/usr/bin/env node
// Entry point of ./tools/limbus. Each command lives in commands/<name>.ts and exports
// `run(args: string[]): Promise<number>` returning the process exit code.
// Exit codes: 0 success, 2 bad input (messages on stderr, nothing on stdout), 1 internal failure.

const COMMANDS: Record<string, string> = {
  solve: 'limb, ring and astrometry solution of one event file',
  time: 'disappearance and reappearance times from a light curve',
  joint: 'one ring pole and radius from several events',
  context: 'Roche limits, resonances and Hill radius for a body',
};

function usage(): string {
  const lines = Object.entries(COMMANDS).map(([name, what]) => `  ${name.padEnd(8)} ${what}`);
  return ['usage: limbus <command> [arguments]', '', 'commands:', ...lines].join('\n');
}

async function main(argv: string[]): Promise<number> {
  const [name, ...args] = argv;
  if (name === undefined || name === '--help' || name === '-h') {
    process.stdout.write(usage() + '\n');
    return name === undefined ? 2 : 0;
  }
  if (!(name in COMMANDS)) {
    process.stderr.write(`limbus: unknown command "${name}"\n${usage()}\n`);
    return 2;
  }
  const command = (await import(`./commands/${name}.js`)) as { run(args: string[]): Promise<number> };
  return command.run(args);
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    process.stderr.write(
      `limbus: internal error: ${error instanceof Error ? error.message : String(error)}\n`,
    );
    process.exitCode = 1;
  },
);
