import { useState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { InlineError } from "@/components/ui/states";
import { useTeam } from "../api/get-team";
import { useUpdateTeam } from "../api/update-team";

// How many approvals (by people other than its author) a revision needs to read as approved; owners set it.
export function RequiredApprovals({ teamId, isOwner }: { teamId: string; isOwner: boolean }) {
  const team = useTeam(teamId);
  const update = useUpdateTeam();
  const [value, setValue] = useState("");
  // The field starts from the stored number, and again whenever the stored number changes.
  const [shown, setShown] = useState<number | null>(null);
  if (team.data && team.data.requiredApprovals !== shown) {
    setShown(team.data.requiredApprovals);
    setValue(String(team.data.requiredApprovals));
  }
  if (!team.data) return null;
  const required = team.data.requiredApprovals;
  if (!isOwner) {
    return (
      <p className="text-xs text-ink/70">
        A revision reads as approved after {required} approval{required === 1 ? "" : "s"} by reviewers other than its author.
      </p>
    );
  }
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(event) => {
        event.preventDefault();
        update.mutate({ teamId, requiredApprovals: Number(value) });
      }}
    >
      <TextField label="Approvals a revision needs" type="number" min={1} max={10} required value={value} onChange={(e) => setValue(e.target.value)} className="w-52" />
      <Button type="submit" disabled={update.isPending || Number(value) === required}>
        {update.isPending ? "Saving…" : "Save"}
      </Button>
      <p className="w-full text-xs text-ink/60">Approvals by the revision's author never count; any standing change request keeps a revision at needs changes.</p>
      <div className="w-full">
        <InlineError error={update.error} />
      </div>
    </form>
  );
}
