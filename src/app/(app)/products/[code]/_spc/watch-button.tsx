"use client";

import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { setWatchingAction } from "./actions";

export function WatchButton({ productCode, watching }: { productCode: string; watching: boolean }) {
  const [pending, startTransition] = useTransition();
  const [message, setMessage] = useState<string | null>(null);
  return (
    <>
      <Button variant="secondary" disabled={pending} onClick={() => startTransition(async () => {
        const result = await setWatchingAction({ productCode, watching: !watching });
        setMessage(result.ok ? null : result.message);
      })}>
        {watching ? "Stop watching" : "Watch this product"}
      </Button>
      {message ? <p role="alert" className="mt-1 text-xs text-alert">{message}</p> : null}
    </>
  );
}
