// Hook for local stand-ins of outside services (mail, payments, object storage) that later issues add.
// Each fake starts on loopback and returns the env variables that point the app at it.

export interface LocalFakes {
  env: Record<string, string>;
  names: string[];
  stop(): Promise<void>;
}

type FakeStarter = () => Promise<{ name: string; env: Record<string, string>; stop(): Promise<void> }>;

// Register starters here, e.g. `startSmtpFake` from scripts/lib/fakes/smtp.ts. None exist yet (issue 2).
const STARTERS: FakeStarter[] = [];

export async function startLocalFakes(): Promise<LocalFakes> {
  const started: Awaited<ReturnType<FakeStarter>>[] = [];
  const stop = async () => {
    for (const fake of started.reverse()) await fake.stop().catch(() => undefined);
  };
  try {
    for (const start of STARTERS) started.push(await start());
  } catch (error) {
    await stop();
    throw error;
  }
  return {
    env: Object.assign({}, ...started.map((fake) => fake.env)),
    names: started.map((fake) => fake.name),
    stop,
  };
}
