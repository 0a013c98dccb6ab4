import { useState } from "react";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { InlineError } from "@/components/ui/states";
import type { Role } from "@/lib/api-contract";
import { useInviteMember } from "../api/invite-member";

// Owners invite by e-mail; the invitation link expires and joins the team with the chosen role.
export function InviteMemberForm({ teamId }: { teamId: string }) {
  const invite = useInviteMember();
  const [email, setEmail] = useState("");
  const [role, setRole] = useState<Role>("reviewer");
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(event) => {
        event.preventDefault();
        if (role === "owner" && !window.confirm(`Invite ${email} as an owner of this team?`)) return;
        invite.mutate({ teamId, email, role }, { onSuccess: () => setEmail("") });
      }}
    >
      <TextField label="Invite by e-mail" type="email" required value={email} onChange={(e) => setEmail(e.target.value)} className="w-64" />
      <SelectField label="Role" value={role} onChange={(e) => setRole(e.target.value as Role)} className="w-32">
        <option value="viewer">viewer</option>
        <option value="reviewer">reviewer</option>
        <option value="editor">editor</option>
        <option value="owner">owner</option>
      </SelectField>
      {role === "owner" && (
        <p className="w-full rounded border border-copper/50 bg-copper/5 px-2 py-1 text-xs" role="alert">
          An owner can change every member's role, remove anyone, invite others and delete the team. Invite as owner only someone you would hand the team to.
        </p>
      )}
      <Button type="submit" disabled={invite.isPending}>
        {invite.isPending ? "Sending…" : "Send invitation"}
      </Button>
      {invite.isSuccess && <p className="w-full text-xs text-verdigris">Invitation sent.</p>}
      <div className="w-full">
        <InlineError error={invite.error} />
      </div>
    </form>
  );
}
