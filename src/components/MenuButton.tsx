import { useEffect, useRef, useState } from "react";

/**
 * The phone menu's button (shown below the md breakpoint by global.css): opens and folds the
 * navigation and the chamber bar (`aria-controls`), says which in `aria-expanded`; opening moves
 * focus to the first link, Escape folds the menu and returns focus here. The open state is set on
 * `<body data-menu>` so the server-rendered navigation follows it without being an island itself.
 */
export default function MenuButton({ controls }: { controls: string }) {
  const [open, setOpen] = useState(false);
  const button = useRef<HTMLButtonElement>(null);
  const moveFocus = useRef(false);

  useEffect(() => {
    document.body.dataset.menu = open ? "open" : "closed";
    if (!moveFocus.current) return;
    moveFocus.current = false;
    if (open) document.querySelector<HTMLElement>(`#${controls.split(" ")[0]} a`)?.focus();
    else button.current?.focus();
  }, [open, controls]);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.key !== "Escape" || !button.current || getComputedStyle(button.current).display === "none") return;
      setOpen((was) => {
        if (was) moveFocus.current = true;
        return false;
      });
    };
    document.addEventListener("keydown", onKey);
    return () => document.removeEventListener("keydown", onKey);
  }, []);

  return (
    <button
      ref={button}
      type="button"
      id="gw-menu-button"
      className="gw-menu-button rounded-md border border-white/50 px-3 py-1.5 text-sm font-semibold text-white hover:bg-white/10"
      aria-expanded={open}
      aria-controls={controls}
      onClick={() => {
        moveFocus.current = true;
        setOpen((o) => !o);
      }}
    >
      Menu
    </button>
  );
}
