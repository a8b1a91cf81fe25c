import type { Command, Option } from "commander";

/**
 * Makes every subcommand report an unknown option before a missing required one (commander checks
 * required options first, so `sample --nope` used to complain about `--scenario`), and marks
 * required options "(required)" in help. Required options become plain options, checked in a
 * preAction hook, which commander runs after its unknown-option check.
 * @param program - the root command, with its subcommands registered.
 */
export function requiredOptionsAfterUnknown(program: Command): void {
  for (const command of program.commands) {
    const required: Option[] = command.options.filter((o) => o.mandatory);
    if (required.length === 0) continue;
    for (const option of required) {
      option.mandatory = false;
      option.description = option.description ? `${option.description} (required)` : "(required)";
    }
    command.hook("preAction", (cmd) => {
      for (const option of required) {
        if (cmd.getOptionValue(option.attributeName()) === undefined) {
          cmd.error(`error: required option '${option.flags}' not specified`, { exitCode: 1, code: "commander.missingMandatoryOptionValue" });
        }
      }
    });
  }
}
