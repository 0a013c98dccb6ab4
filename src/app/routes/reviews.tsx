import { NavLink } from "react-router-dom";
import { RequireAccount } from "@/features/auth";
import { ReviewQueueTable } from "@/features/review";

function ReviewTabs() {
  const tab = ({ isActive }: { isActive: boolean }) => (isActive ? "border-b-2 border-copper pb-1 text-copper" : "pb-1 hover:text-copper");
  return (
    <nav aria-label="Review pages" className="mt-2 flex gap-4 text-sm">
      <NavLink to="/reviews/awaiting" className={tab}>
        Awaiting my review
      </NavLink>
      <NavLink to="/reviews/mine" className={tab}>
        My revisions in review
      </NavLink>
    </nav>
  );
}

export function AwaitingReviewRoute() {
  return (
    <RequireAccount>
      {() => (
        <section>
          <h1 className="text-2xl font-semibold tracking-tight">Awaiting my review</h1>
          <ReviewTabs />
          <p className="mt-3 text-sm text-ink/70">The latest open revision of each network in your teams where you review, did not solve it and have given no verdict; longest waiting first.</p>
          <div className="mt-3">
            <ReviewQueueTable queue="awaiting" empty="Nothing waits for your review." />
          </div>
        </section>
      )}
    </RequireAccount>
  );
}

export function MyRevisionsInReviewRoute() {
  return (
    <RequireAccount>
      {() => (
        <section>
          <h1 className="text-2xl font-semibold tracking-tight">My revisions in review</h1>
          <ReviewTabs />
          <p className="mt-3 text-sm text-ink/70">Revisions you solved that are the latest of their network and not approved yet; newest first.</p>
          <div className="mt-3">
            <ReviewQueueTable queue="mine" empty="None of your revisions is waiting for review." />
          </div>
        </section>
      )}
    </RequireAccount>
  );
}
