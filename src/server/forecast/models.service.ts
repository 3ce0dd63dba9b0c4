// Use cases of the model registry: list versions, import a new version (stored inactive) from a
// JSON definition or a CSV table, and switch versions on or off — at most one active per key.
import { and, asc, desc, eq, ne } from "drizzle-orm";
import { getDb } from "@/db/client";
import { models } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import type { ModelImport, ModelVersionView } from "@/lib/schemas/models";
import { recordAudit } from "@/server/audit/audit.db";
import { AppError, type FieldErrors } from "@/server/http/errors";
import { isModelKind, parseModelParams } from "@/server/scoring/model-params";
import { compileModel, ModelParamsError } from "@/server/scoring/models";
import { paramsFromCsv } from "./model-csv";
import {
  findModel,
  findModelVersion,
  forgetCompiledModels,
  toDefinition,
  type RegisteredModel,
} from "./models.db";
import { isUniqueViolation } from "./unique-violation";

function toView(row: RegisteredModel): ModelVersionView {
  return {
    id: row.id,
    key: row.key,
    version: row.version,
    kind: row.kind,
    name: row.name,
    provenance: row.provenance,
    params: row.params,
    isActive: row.isActive,
    isDemo: row.isDemo,
    createdAt: row.createdAt.toISOString(),
  };
}

export async function listModelVersions(): Promise<ModelVersionView[]> {
  const rows = await getDb()
    .select()
    .from(models)
    .orderBy(asc(models.key), desc(models.createdAt), desc(models.id));
  return rows.map(toView);
}

/** Parameters from the request, checked against the kind's schema; field errors name the form field. */
function buildParams(input: ModelImport): unknown {
  const fromCsv = input.format === "csv" ? paramsFromCsv(input) : null;
  if (fromCsv && !fromCsv.ok)
    throw new AppError("BAD_REQUEST", "Some cells of the table need attention.", {
      fields: fromCsv.fields,
    });
  if (!isModelKind(input.kind))
    throw new AppError("BAD_REQUEST", "Unknown model kind.", {
      fields: { kind: "Choose the model kind." },
    });
  const parsed = parseModelParams(input.kind, fromCsv ? fromCsv.params : input.params);
  if (parsed.ok) return parsed.params;
  const fields: FieldErrors = {};
  for (const e of parsed.fieldErrors) {
    // Form-level numbers of a CSV import are fields of their own; everything else is a parameter.
    const isFormField = fromCsv && (e.path === "correctionFactor" || e.path === "windowHours");
    const key = isFormField ? e.path : e.path ? `params.${e.path}` : "params";
    fields[key] ??= e.message;
  }
  throw new AppError("BAD_REQUEST", "The parameters do not fit the model kind.", { fields });
}

/** Stores a new version, inactive: an admin switches it on deliberately after reading it. */
export async function importModelVersion(
  input: ModelImport,
  actor: CurrentUser,
): Promise<ModelVersionView> {
  const params = buildParams(input);
  const duplicate = () =>
    new AppError(
      "CONFLICT",
      `${input.key} version ${input.version} is already in the registry; give the new table a new version.`,
      { fields: { version: "This version exists already." } },
    );
  if (await findModelVersion(input.key, input.version)) throw duplicate();
  try {
    return await getDb().transaction(async (tx) => {
      const [row] = await tx
        .insert(models)
        .values({
          key: input.key,
          version: input.version,
          kind: input.kind,
          name: input.name,
          provenance: input.provenance,
          params,
          isActive: false,
          isDemo: false,
          createdBy: actor.id,
        })
        .returning();
      if (!row) throw new Error("model insert returned nothing");
      await recordAudit(
        {
          actor: { id: actor.id, email: actor.email },
          action: "model.imported",
          targetType: "model",
          targetId: row.id,
          details: {
            key: row.key,
            version: row.version,
            kind: row.kind,
            format: input.format,
            provenance: row.provenance,
          },
        },
        tx,
      );
      return toView(row);
    });
  } catch (err) {
    if (isUniqueViolation(err)) throw duplicate();
    throw err;
  }
}

function ensureCompiles(row: RegisteredModel): void {
  try {
    compileModel(toDefinition(row));
  } catch (err) {
    if (err instanceof ModelParamsError)
      throw new AppError(
        "UNPROCESSABLE_CONTENT",
        `${row.key} ${row.version} cannot be activated: ${err.message}`,
        { cause: err },
      );
    throw err;
  }
}

/** Activating a version deactivates the key's other versions in the same transaction. */
export async function setModelActive(
  id: number,
  isActive: boolean,
  actor: CurrentUser,
): Promise<ModelVersionView[]> {
  const target = await findModel(id);
  if (!target) throw new AppError("NOT_FOUND", "No such model version.");
  if (isActive) ensureCompiles(target);
  const who = { id: actor.id, email: actor.email };
  await getDb().transaction(async (tx) => {
    const replaced = isActive
      ? await tx
          .update(models)
          .set({ isActive: false })
          .where(and(eq(models.key, target.key), ne(models.id, id), eq(models.isActive, true)))
          .returning({ id: models.id, version: models.version })
      : [];
    if (target.isActive !== isActive) {
      await tx.update(models).set({ isActive }).where(eq(models.id, id));
      const action = isActive ? "model.activated" : "model.deactivated";
      await recordAudit(
        {
          actor: who,
          action,
          targetType: "model",
          targetId: id,
          details: {
            key: target.key,
            version: target.version,
            replaced: replaced.map((r) => r.version),
          },
        },
        tx,
      );
    }
    for (const r of replaced) {
      await recordAudit(
        {
          actor: who,
          action: "model.deactivated",
          targetType: "model",
          targetId: r.id,
          details: { key: target.key, version: r.version, replacedBy: target.version },
        },
        tx,
      );
    }
  });
  forgetCompiledModels();
  return (await listModelVersions()).filter((m) => m.key === target.key);
}
