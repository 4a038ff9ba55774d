/**
 * Operator command line.
 *
 *   npm run --silent cli -- gateway create --asset <asset id> --name <name>
 *   npm run --silent cli -- token create --email <user e-mail> [--org <organisation id>] [--name <label>]
 *
 * Prints one JSON object on stdout; the gateway key / API token appears only here, once.
 * Errors: a message on stderr and exit code 2 (usage) or 1 (refused).
 */
import { closeDb } from "@/lib/db/knex";
import { isAppError } from "@/lib/http/errors";
import { createApiTokenAsOperator, createGatewayAsOperator } from "@/lib/services/ingest/operator.service";

class UsageError extends Error {}

const USAGE = [
  "usage: npm run --silent cli -- gateway create --asset <asset id> --name <name>",
  "       npm run --silent cli -- token create --email <user> [--org <organisation id>] [--name <label>]",
].join("\n");

function options(argv: string[], allowed: string[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (!a.startsWith("--")) throw new UsageError(`unexpected argument ${JSON.stringify(a)}`);
    const [key, inline] = a.slice(2).split("=", 2);
    if (!allowed.includes(key)) throw new UsageError(`unknown option --${key}`);
    const value = inline ?? argv[++i];
    if (value === undefined || value.startsWith("--")) throw new UsageError(`--${key} needs a value`);
    out[key] = value;
  }
  return out;
}

async function run(argv: string[]): Promise<unknown> {
  const [noun, verb, ...rest] = argv;
  if (noun === "gateway" && verb === "create") {
    const o = options(rest, ["asset", "name"]);
    if (!o.asset || !o.name) throw new UsageError("gateway create needs --asset and --name");
    const { gateway, key } = await createGatewayAsOperator({ assetId: o.asset, name: o.name });
    return { gateway: { id: gateway.id, assetId: gateway.assetId, name: gateway.name, keyPrefix: gateway.keyPrefix }, key };
  }
  if (noun === "token" && verb === "create") {
    const o = options(rest, ["email", "org", "name"]);
    if (!o.email) throw new UsageError("token create needs --email");
    const out = await createApiTokenAsOperator({ email: o.email, organisationId: o.org, name: o.name });
    return { token: out.token, apiToken: out.apiToken, organisationId: out.organisationId, role: out.role };
  }
  throw new UsageError(noun ? `unknown command ${[noun, verb].filter(Boolean).join(" ")}` : "no command");
}

async function main(): Promise<number> {
  try {
    process.stdout.write(`${JSON.stringify(await run(process.argv.slice(2)), null, 2)}\n`);
    return 0;
  } catch (e) {
    if (e instanceof UsageError) {
      process.stderr.write(`${e.message}\n${USAGE}\n`);
      return 2;
    }
    process.stderr.write(`${isAppError(e) ? e.message : e instanceof Error ? e.message : String(e)}\n`);
    return 1;
  } finally {
    await closeDb();
  }
}

void main().then((code) => {
  process.exitCode = code;
});
