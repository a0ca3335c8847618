// The queue's fair order (issue 9, item 6): round-robin over teams by when each was last served,
// then over that team's owners, each owner's oldest sweep first.
import { describe, expect, it } from "vitest";
import { fairOrder, type FairCandidate } from "~/workers/queue.server";

const c = (id: number, team: number, owner: number, teamServed = -Infinity, ownerServed = -Infinity): FairCandidate => ({ id, team, owner, teamServed, ownerServed });

describe("fairOrder", () => {
  it("one team's four sweeps queued first do not keep another team's one waiting behind them", () => {
    const list = [c(1, 1, 10), c(2, 1, 10), c(3, 1, 10), c(4, 1, 10), c(5, 2, 20)];
    expect(fairOrder(list, 5)).toEqual([1, 5, 2, 3, 4]);
  });
  it("the team served least recently goes first; never served before all", () => {
    const list = [c(1, 1, 10, 500, 500), c(2, 2, 20, 100, 100), c(3, 3, 30)];
    expect(fairOrder(list, 3)).toEqual([3, 2, 1]);
  });
  it("inside a team, owners take turns (the least recently served first), each with their oldest sweep", () => {
    const list = [c(1, 1, 10, 50, 50), c(2, 1, 10, 50, 50), c(3, 1, 11, 50), c(4, 1, 11, 50)];
    expect(fairOrder(list, 4)).toEqual([3, 1, 4, 2]);
  });
  it("stops at n", () => {
    expect(fairOrder([c(1, 1, 10), c(2, 2, 20), c(3, 3, 30)], 2)).toEqual([1, 2]);
  });
});
