import { internalRoute } from "@/server/http/route";
import { deliverPendingEmail } from "@/server/mail/outbox";

export const dynamic = "force-dynamic";

export const POST = internalRoute(async () => Response.json(await deliverPendingEmail(50)));
