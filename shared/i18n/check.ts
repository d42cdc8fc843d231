// The checks every catalogue passes: the same keys as English, ICU syntax that parses, the same arguments.
import { parse, TYPE, type MessageFormatElement } from '@formatjs/icu-messageformat-parser';

/** Argument names a message uses, with plural/select options walked. */
export function argumentsOf(message: string): string[] {
  const names = new Set<string>();
  const walk = (elements: MessageFormatElement[]) => {
    for (const element of elements) {
      if (element.type === TYPE.literal || element.type === TYPE.pound) continue;
      if (element.type === TYPE.tag) {
        walk(element.children);
        continue;
      }
      names.add(element.value);
      if (element.type === TYPE.plural || element.type === TYPE.select) {
        for (const option of Object.values(element.options)) walk(option.value);
      }
    }
  };
  walk(parse(message));
  return [...names].sort();
}

/** Every problem of every catalogue against the reference, one line each; empty when all are complete. */
export function catalogueProblems(reference: Record<string, string>, catalogues: Record<string, Record<string, string>>): string[] {
  const problems: string[] = [];
  const referenceArgs = new Map<string, string[]>();
  for (const [key, message] of Object.entries(reference)) {
    try {
      referenceArgs.set(key, argumentsOf(message));
    } catch (error) {
      problems.push(`reference ${key}: ICU syntax error (${(error as Error).message})`);
    }
  }
  for (const [language, catalogue] of Object.entries(catalogues)) {
    for (const key of Object.keys(reference)) {
      if (!(key in catalogue)) problems.push(`${language}: missing key ${key}`);
    }
    for (const [key, message] of Object.entries(catalogue)) {
      if (!(key in reference)) {
        problems.push(`${language}: extra key ${key}`);
        continue;
      }
      if (typeof message !== 'string' || message.trim() === '') {
        problems.push(`${language} ${key}: empty message`);
        continue;
      }
      let args: string[];
      try {
        args = argumentsOf(message);
      } catch (error) {
        problems.push(`${language} ${key}: ICU syntax error (${(error as Error).message})`);
        continue;
      }
      const expected = referenceArgs.get(key);
      if (expected && args.join(',') !== expected.join(',')) {
        problems.push(`${language} ${key}: arguments {${args.join(', ')}} differ from English {${expected.join(', ')}}`);
      }
    }
  }
  return problems;
}
