import { useState } from "react";
import { useNavigate } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { InlineError } from "@/components/ui/states";
import { useCreateTeam } from "../api/create-team";

export function CreateTeamForm() {
  const create = useCreateTeam();
  const navigate = useNavigate();
  const [name, setName] = useState("");
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(event) => {
        event.preventDefault();
        create.mutate(
          { name: name.trim() },
          {
            onSuccess: (team) => {
              // The field empties, so coming back to this page does not offer the same team again.
              setName("");
              navigate(`/teams/${team.id}`);
            },
          },
        );
      }}
    >
      <TextField label="New team" required value={name} onChange={(e) => setName(e.target.value)} className="w-full max-w-64" placeholder="e.g. Power stage reviews" />
      <Button type="submit" disabled={create.isPending || !name.trim()}>
        {create.isPending ? "Creating…" : "Create team"}
      </Button>
      <InlineError error={create.error} />
    </form>
  );
}
