// /local/mail: what the local fake SMTP server received (local and test mode
// only), for the workspace's owner: it holds every invitation's link.
import { data } from "react-router";
import type { Route } from "./+types/mail";
import { PageHeader } from "~/components/common/PageHeader";
import { requireAccess } from "~/platform/access.server";
import { formatTime } from "~/platform/format";
import { localInbox } from "~/platform/mail.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "mail.readLocal" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  await requireAccess(request, permissions.loader);
  const messages = await localInbox();
  if (!messages) throw data({ message: "The local inbox exists only when Gaitloom runs on this machine." }, { status: 404 });
  return { messages };
}

export const meta: Route.MetaFunction = () => [{ title: "Local inbox · Gaitloom" }];

// Makes the links in a plain-text mail clickable.
function Linked({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/\S+)/g);
  return (
    <>
      {parts.map((part, i) =>
        /^https?:\/\//.test(part) ? (
          <a key={i} href={part} className="text-accent underline">
            {part}
          </a>
        ) : (
          part
        ),
      )}
    </>
  );
}

export default function LocalMail({ loaderData }: Route.ComponentProps) {
  return (
    <>
      <PageHeader title="Local inbox" lead="E-mail the app sent while running on this machine; nothing left it." />
      {loaderData.messages.length === 0 ? (
        <p className="text-ink-muted">No mail yet. Invitations and review requests appear here.</p>
      ) : (
        <ol className="space-y-4">
          {loaderData.messages.map((message) => (
            <li key={message.id}>
              <article aria-label={message.subject} className="rounded-lg border border-line bg-surface p-4">
                <h2 className="font-semibold">{message.subject}</h2>
                <p className="text-sm text-ink-muted">
                  To {message.to.join(", ")} · {formatTime(message.receivedAt, { seconds: true })}
                </p>
                <pre className="mt-3 whitespace-pre-wrap font-sans text-sm">
                  <Linked text={message.text} />
                </pre>
              </article>
            </li>
          ))}
        </ol>
      )}
    </>
  );
}
