// The start the robot page and the revision page share: the member, the
// address's parameters, and the robot they name in the member's workspace
// with its revision history; an address that names none is the page's 404.
import { data } from "react-router";
import type { z } from "zod";
import { requireAccess } from "~/platform/access.server";
import type { Action } from "~/platform/permissions";
import { getRobot } from "~/features/robots/robots.server";

/** The page's 404, with the sentence it shows. */
export const notFoundPage = (message: string) => data({ message }, { status: 404 });

export async function loadRobotPage<Params extends { robotId: string }>(
  request: Request,
  permission: Action,
  schema: z.ZodType<Params>,
  params: unknown,
  notFound: string,
) {
  const member = await requireAccess(request, permission);
  const parsed = schema.safeParse(params);
  if (!parsed.success) throw notFoundPage(notFound);
  const robot = await getRobot(member.workspace.id, parsed.data.robotId);
  if (!robot) throw notFoundPage(notFound);
  return { member, address: parsed.data, robot };
}
