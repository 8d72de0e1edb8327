#!/usr/bin/env node
// Entry point of ./tools/limbus. Each command lives in commands/<name>.ts and exports
// `run(args: string[]): Promise<number>` returning the process exit code.
// Exit codes: 0 success, 2 bad input (messages on stderr, nothing on stdout), 1 internal failure.

interface Command {
  run(args: string[]): Promise<number>;
}

// Each command is loaded only when asked for (module loading is most of a command's start-up), by a
// literal import a bundler can follow.
const COMMANDS: Record<string, { what: string; load: () => Promise<Command> }> = {
  solve: {
    what: 'limb, ring and astrometry solution of one event file',
    load: () => import('./commands/solve.js'),
  },
  predict: {
    what: "shadow path and each station's predicted times from one event file",
    load: () => import('./commands/predict.js'),
  },
  time: {
    what: 'disappearance and reappearance times from a light curve',
    load: () => import('./commands/time.js'),
  },
  joint: { what: 'one ring pole and radius from several events', load: () => import('./commands/joint.js') },
  context: {
    what: 'Roche limits, resonances and Hill radius for a body',
    load: () => import('./commands/context.js'),
  },
};

function usage(): string {
  const lines = Object.entries(COMMANDS).map(([name, { what }]) => `  ${name.padEnd(8)} ${what}`);
  return ['usage: limbus <command> [arguments]', '', 'commands:', ...lines].join('\n');
}

async function main(argv: string[]): Promise<number> {
  const [name, ...args] = argv;
  if (name === undefined || name === '--help' || name === '-h') {
    process.stdout.write(usage() + '\n');
    return name === undefined ? 2 : 0;
  }
  const command = Object.hasOwn(COMMANDS, name) ? COMMANDS[name] : undefined;
  if (command === undefined) {
    process.stderr.write(`limbus: unknown command "${name}"\n${usage()}\n`);
    return 2;
  }
  return (await command.load()).run(args);
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
