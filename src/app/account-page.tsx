import { AccountPage } from "../features/auth/components/AccountPage";
import { CalendarFeeds } from "../features/calendar/components/CalendarFeeds";

/** The account page with each channel's calendar feed under the person's own settings. */
export function AccountPageWithFeeds() {
  return (
    <>
      <AccountPage />
      <CalendarFeeds />
    </>
  );
}
