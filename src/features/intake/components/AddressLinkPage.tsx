import { useParams } from "react-router-dom";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { QueryState } from "../../../components/States";
import { useMe } from "../../../lib/session";
import { useAddressLink } from "../api/public-page";
import { PublicFrame } from "./SuggestPage";

const words = {
  confirm: { title: "Confirm your address", lead: "Confirm this address to hear once from the channel when a video comes of your suggestion.", button: "Confirm my address", done: "Thank you: your address is confirmed." },
  stop: { title: "Stop these mails", lead: "The channel will write to this address no more about your suggestions.", button: "Stop the mails", done: "Done: no more mail about suggestions will come to this address." },
} as const;

/**
 * A link mailed to a viewer. It acts only when the button is pressed, so a mail program that opens
 * links to check them confirms or stops nothing.
 */
export function AddressLinkPage({ action }: { action: "confirm" | "stop" }) {
  const { token = "" } = useParams();
  const me = useMe();
  const link = useAddressLink(action);
  const w = words[action];
  return (
    <PublicFrame>
      <QueryState query={me} loading="Opening…">
        {() => (
          <section className="flex flex-col items-start gap-4 rounded-xl border border-ply-300 bg-white p-5 shadow-sm sm:p-8">
            <h1 className="text-xl font-bold">{w.title}</h1>
            {link.isSuccess ? (
              <Notice kind="success">{w.done}</Notice>
            ) : (
              <>
                <p className="text-graphite-700">{w.lead}</p>
                {link.error && <Notice kind="error">{link.error.message}</Notice>}
                <Button busy={link.isPending} onClick={() => link.mutate(token)}>
                  {w.button}
                </Button>
              </>
            )}
          </section>
        )}
      </QueryState>
    </PublicFrame>
  );
}

export const ConfirmAddressPage = () => <AddressLinkPage action="confirm" />;
export const StopNewsPage = () => <AddressLinkPage action="stop" />;
