import { createContext, useContext, useEffect, useMemo, useState, type ReactNode } from 'react';
import { setActiveClub } from '@/features/api/client';
import type { Me, Membership } from '@/features/auth/api/get-me';

const STORAGE_KEY = 'squadline.activeClub';

type ActiveClub = { me: Me; membership: Membership; choose(clubId: string): void };
const Context = createContext<ActiveClub | null>(null);

function readStored(): string | null {
  try {
    return globalThis.localStorage?.getItem(STORAGE_KEY) ?? null;
  } catch {
    return null;
  }
}

/** Which of the person's clubs (and so which role) the app is working in. */
export function ActiveClubProvider({ me, children }: { me: Me; children: ReactNode }) {
  const [chosen, setChosen] = useState<string | null>(readStored);
  const membership = me.memberships.find((m) => m.clubId === chosen) ?? me.memberships[0]!;
  useEffect(() => {
    setActiveClub(membership.clubId);
  }, [membership.clubId]);
  // Set synchronously too, so the first queries of the screen already carry the club.
  setActiveClub(membership.clubId);
  const value = useMemo<ActiveClub>(
    () => ({
      me,
      membership,
      choose(clubId) {
        try {
          globalThis.localStorage?.setItem(STORAGE_KEY, clubId);
        } catch {
          // private mode: the choice lasts for this visit only
        }
        setChosen(clubId);
      },
    }),
    [me, membership],
  );
  return <Context.Provider value={value}>{children}</Context.Provider>;
}

export function useActiveClub(): ActiveClub {
  const value = useContext(Context);
  if (!value) throw new Error('useActiveClub must be used inside ActiveClubProvider');
  return value;
}
