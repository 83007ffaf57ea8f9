import { listMembers } from "@/lib/commands/organisation";
import { routeHandler } from "@/lib/server/route";

export const GET = routeHandler(listMembers, () => ({}), {
  respond: (members) => Response.json({ items: members }),
});
