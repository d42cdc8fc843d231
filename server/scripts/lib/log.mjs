// One voice for the start and test scripts: short lines prefixed by what is speaking.
export function say(who, message) {
  process.stdout.write(`[${who}] ${message}\n`);
}
