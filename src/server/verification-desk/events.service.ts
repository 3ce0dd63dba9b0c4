// Use cases of single observed events: enter one by hand and correct one, each audited (a
// correction with the event before and after).
import { getDb } from "@/db/client";
import type { CurrentUser } from "@/lib/auth/roles";
import type { EventView } from "@/lib/query/verification";
import type { EventCorrectionData, EventEntryData } from "@/lib/schemas/verification";
import { recordAudit } from "@/server/audit/audit.db";
import { AppError } from "@/server/http/errors";
import { checkEventValues } from "./event-rows";
import {
  findOrCreateManualList,
  getEvent,
  insertEvents,
  isUniqueViolation,
  updateEvent,
} from "./events.db";

const actorOf = (u: CurrentUser) => ({ id: u.id, email: u.email });

function validOrThrow(
  values: Parameters<typeof checkEventValues>[0],
  convention: EventView["convention"],
) {
  const { event, errors } = checkEventValues(values, convention);
  if (!event)
    throw new AppError("BAD_REQUEST", "Some fields need attention.", {
      fields: { ...errors, ...(errors.region ? { regionNumber: errors.region } : {}) } as Record<
        string,
        string
      >,
    });
  return event;
}

function toValues(d: {
  start: string;
  peak: string;
  end: string;
  goesClass: string;
  regionNumber: string;
}) {
  return {
    start: d.start,
    peak: d.peak,
    end: d.end,
    goesClass: d.goesClass,
    region: d.regionNumber,
  };
}

const DUPLICATE = "An event with the same peak time and peak flux is already stored.";

export async function createEvent(data: EventEntryData, actor: CurrentUser): Promise<EventView> {
  const event = validOrThrow(toValues(data), data.convention);
  try {
    return await getDb().transaction(async (tx) => {
      const listId = await findOrCreateManualList(tx, data.convention, actor.id);
      const [id] = await insertEvents(tx, listId, [event], actor.id);
      const view = await getEvent(id as number, tx);
      if (!view) throw new Error("the new event could not be read back");
      await recordAudit(
        {
          actor: actorOf(actor),
          action: "event.created",
          targetType: "flare_event",
          targetId: view.id,
          details: { after: view },
        },
        tx,
      );
      return view;
    });
  } catch (err) {
    if (isUniqueViolation(err))
      throw new AppError("CONFLICT", DUPLICATE, { fields: { peak: DUPLICATE }, cause: err });
    throw err;
  }
}

/** A correction keeps the event's list (and so its convention) and records before and after. */
export async function correctEvent(
  id: number,
  data: EventCorrectionData,
  actor: CurrentUser,
): Promise<EventView> {
  try {
    return await getDb().transaction(async (tx) => {
      const before = await getEvent(id, tx);
      if (!before) throw new AppError("NOT_FOUND", "There is no such event.");
      await updateEvent(tx, id, validOrThrow(toValues(data), before.convention), actor.id);
      const after = (await getEvent(id, tx)) as EventView;
      await recordAudit(
        {
          actor: actorOf(actor),
          action: "event.corrected",
          targetType: "flare_event",
          targetId: id,
          details: { reason: data.reason, before, after },
        },
        tx,
      );
      return after;
    });
  } catch (err) {
    if (isUniqueViolation(err))
      throw new AppError("CONFLICT", DUPLICATE, { fields: { peak: DUPLICATE }, cause: err });
    throw err;
  }
}
