"use client";

import { useEffect, useState } from "react";

/** Time left until the deadline, on the server's clock (the page passes the server's "now"). */
export function Countdown({ deadline, serverNow, label }: { deadline: string; serverNow: string; label: string }) {
  const [skew] = useState(() => Date.parse(serverNow) - Date.now());
  const [now, setNow] = useState(() => Date.parse(serverNow));
  useEffect(() => {
    const tick = () => setNow(Date.now() + skew);
    tick();
    const timer = setInterval(tick, 1000);
    return () => clearInterval(timer);
  }, [skew]);
  const left = Date.parse(deadline) - now;
  if (left <= 0) {
    return (
      <p className="rounded-md bg-slate-900 px-3 py-2 text-base font-semibold text-white" role="status">
        Bidding closed at {label}
      </p>
    );
  }
  const m = Math.floor(left / 60_000);
  const days = Math.floor(m / 1440);
  const hours = Math.floor((m % 1440) / 60);
  const minutes = m % 60;
  const text = days > 0 ? `${days} d ${hours} h` : hours > 0 ? `${hours} h ${minutes} min` : `${minutes} min ${Math.floor((left % 60_000) / 1000)} s`;
  return (
    <p className={`rounded-md px-3 py-2 text-base ${days === 0 ? "bg-amber-100 text-amber-950" : "bg-sky-50 text-sky-950"}`}>
      Closes in <strong className="font-semibold">{text}</strong> · {label}
    </p>
  );
}
