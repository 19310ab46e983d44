import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";

// mariadb_watch (scripts/lib/mariadb.sh), the MariaDB supervision of npm start, driven one look at a
// time with the clock (bash's SECONDS) set by hand and the server start stubbed, so the pauses and
// the limit are checked exactly and at once. tests/integration/npm-start.test.ts kills a real one.

/** Runs `body` in bash with the script libraries loaded and the start of MariaDB replaced by `startStub`. */
function watch(startStub: string, body: string): { out: string; err: string } {
  const script = `
set -euo pipefail
source scripts/lib/common.sh
source scripts/lib/mariadb.sh
MDB_LOG=/tmp/mysqld.err
ALIVE=
pid_running() { [[ -n $1 && $1 == "$ALIVE" ]]; }
_mariadb_reap() { MDB_EXIT="killed by SIGKILL"; }
STARTS=0
mariadb_try_start() {
  STARTS=$((STARTS + 1))
  echo "start $STARTS at $SECONDS"
  ${startStub}
}
${body}
`;
  const r = spawnSync("bash", ["-c", script], { encoding: "utf8" });
  if (r.status !== 0) throw new Error(`bash exited ${r.status}: ${r.stderr}`);
  return { out: r.stdout, err: r.stderr };
}

/** One look per second from second FROM to TO; stops at the first refusal and says when. */
const tick = (from: number, to: number) => `
for ((t = ${from}; t <= ${to}; t++)); do
  SECONDS=$t
  if ! mariadb_watch; then echo "gave up at $t"; break; fi
done`;

const startsAt = (out: string) => [...out.matchAll(/^start \d+ at (\d+)$/gm)].map((m) => Number(m[1]));

describe("npm start's watch over MariaDB", () => {
  it("a server that never comes back is tried five times with pauses of 1, 2, 4, 8 and 16 s, then given up", () => {
    const { out, err } = watch("MDB_PID=; return 1", `MDB_PID=4242\n${tick(0, 200)}`);
    // Each pause starts at the look after the failure that it follows.
    expect(startsAt(out)).toEqual([1, 4, 9, 18, 35]);
    expect(out).toMatch(/^gave up at 36$/m);
    expect(err).toMatch(
      /MariaDB \(pid 4242\) stopped unexpectedly \(killed by SIGKILL\); restarting it in 1 s \(attempt 1 of 5\)/,
    );
    expect(err).toMatch(/did not start again\); restarting it in 16 s \(attempt 5 of 5\)/);
    expect(err).toMatch(/after 5 restarts in a row; giving up\. Its log: \/tmp\/mysqld\.err/);
  });

  it("a server that comes back and stays up a minute starts the count afresh; one that dies again sooner does not", () => {
    // Comes back at once every time (a new pid each start), and is killed at the seconds given.
    const stub = `MDB_PID=$((5000 + STARTS)); ALIVE=$MDB_PID; return 0`;
    const kill = (at: number[]) => at.map((t) => `[[ $t == ${t} ]] && ALIVE=`).join("\n  ");
    const body = (kills: number[]) => `
MDB_PID=5000; ALIVE=5000
for ((t = 0; t <= 300; t++)); do
  SECONDS=$t
  ${kill(kills)}
  mariadb_watch || { echo "gave up at $t"; break; }
done
echo "restarts $MDB_RESTARTS"`;

    // Killed at 10, back at 11; killed again at 30 (19 s up): the second pause is 2 s.
    const soon = watch(stub, body([10, 30]));
    expect(startsAt(soon.out)).toEqual([11, 32]);
    expect(soon.err).toMatch(/restarting it in 2 s \(attempt 2 of 5\)/);

    // Killed at 10, back at 11; killed again at 100 (89 s up): the pause is 1 s again.
    const late = watch(stub, body([10, 100]));
    expect(startsAt(late.out)).toEqual([11, 101]);
    expect(late.err).not.toMatch(/attempt 2 of 5/);
    // Up for good since 101: counted healthy again by the end.
    expect(late.out).toMatch(/^restarts 0$/m);
    expect(late.out).not.toMatch(/gave up/);
    expect(late.out).toMatch(/MariaDB is back \(pid 5002\)/);
  });
});
