import { useState, type FormEvent } from "react";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";

const recipientSchema = z.email("enter a whole e-mail address, such as analyst@example.com");

interface RecipientFilterProps {
  /** The recipient shown now, or undefined for every message. */
  value: string | undefined;
  onChange: (to: string | undefined) => void;
}

/** Narrows the mailbox to one recipient; the address is checked here, so the server never sees a half-typed one. */
export function RecipientFilter({ value, onChange }: RecipientFilterProps) {
  const [draft, setDraft] = useState(value ?? "");
  const [error, setError] = useState<string | undefined>();

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const typed = draft.trim();
    if (typed === "") {
      setError(undefined);
      onChange(undefined);
      return;
    }
    const parsed = recipientSchema.safeParse(typed);
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message);
      return;
    }
    setError(undefined);
    onChange(parsed.data.toLowerCase());
  };

  return (
    <form onSubmit={submit} noValidate aria-label="Filter by recipient" className="flex flex-wrap items-start gap-2">
      <Field
        label="Recipient"
        type="email"
        value={draft}
        onChange={(e) => setDraft(e.target.value)}
        placeholder="someone@example.com"
        hint={error ? undefined : "Leave empty to list every message."}
        error={error}
        autoComplete="off"
        containerClassName="w-full max-w-sm"
      />
      <div className="flex gap-2 sm:pt-6">
        <Button type="submit" variant="secondary">
          Show
        </Button>
        {value ? (
          <Button
            variant="ghost"
            onClick={() => {
              setDraft("");
              setError(undefined);
              onChange(undefined);
            }}
          >
            Show all
          </Button>
        ) : null}
      </div>
    </form>
  );
}
