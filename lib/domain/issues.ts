import type { z } from "zod";
import { AppError } from "./errors.ts";

/** `crew[3].base` from ["crew", 3, "base"], `bids["004711"]` for a record key: where an issue is, as a person reads it. */
export function formatPath(path: ReadonlyArray<PropertyKey>): string {
  return path.reduce<string>((text, key) => {
    if (typeof key === "number") return `${text}[${key}]`;
    const name = String(key);
    if (!/^[A-Za-z_$][\w$]*$/.test(name)) return `${text}[${JSON.stringify(name)}]`;
    return text === "" ? name : `${text}.${name}`;
  }, "");
}

/**
 * One line per issue, "where: what". Messages that already begin with their
 * place (the cross checks write `crew[3].base "XYZ" …`) are not prefixed again.
 */
export function describeIssues(error: z.ZodError): string[] {
  return error.issues.map((issue) => {
    const where = formatPath(issue.path);
    const head = issue.message.split(" ", 1)[0] ?? "";
    const placed = head === where || (/[[.]/.test(head) && where.startsWith(head));
    return where === "" || placed ? issue.message : `${where}: ${issue.message}`;
  });
}

/** An AppError("invalid") for a failed parse, naming `what` was parsed and listing each issue. */
export function invalidInput(what: string, error: z.ZodError): AppError {
  const lines = describeIssues(error);
  return new AppError("invalid", `${what} is not valid: ${lines.join("; ")}`, { issues: lines });
}
