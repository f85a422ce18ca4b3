"""Helpers for label_election_0345.py: load the election demo data, apply
the replay batches up to the moment, and compute the facts a reply must
(or must not) contain.  Standard library only."""

import glob
import json
import os
from datetime import datetime

HERE = os.path.dirname(os.path.abspath(__file__))
DATA = os.path.normpath(os.path.join(HERE, "..", "..", "..", "..", "dataset-demo", "election"))

WORDS = ["zero", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine"]


def count_text(n):
    """Counts from one to nine as words, 10 and up as figures."""
    return WORDS[n] if 0 <= n <= 9 else str(n)


def votes_text(n):
    return f"{n:,}"


def ordinal(n):
    if 10 <= n % 100 <= 20:
        suf = "th"
    else:
        suf = {1: "st", 2: "nd", 3: "rd"}.get(n % 10, "th")
    return f"{n}{suf}"


def share_text(v, total):
    return f"{round(100.0 * v / total + 1e-9, 1):.1f}%"


def counted_text(fraction):
    # whole percent rounded down (guard against float noise: 0.9*100 = 90.00000000000001)
    return f"{int(fraction * 100 + 1e-9)}%"


def _load(name):
    with open(os.path.join(DATA, name), encoding="utf-8") as fh:
        return json.load(fh)


class Election:
    def __init__(self, moment_iso):
        self.moment = datetime.fromisoformat(moment_iso)
        self.groups = {g["id"]: g for g in _load("groups.json")}
        self.people = {c["id"]: c for c in _load("competitors.json")}
        sports = _load("sports.json")
        self.wards = {d["id"]: d for s in sports for d in s["disciplines"]}
        self.contests = {c["id"]: dict(c) for c in _load("contests.json")}
        # history of states per contest: list of (as_of, snapshot)
        self.history = {cid: [] for cid in self.contests}
        self.batches = []
        for path in sorted(glob.glob(os.path.join(DATA, "replay", "*.json"))):
            batch = json.load(open(path, encoding="utf-8"))
            as_of = datetime.fromisoformat(batch["as_of"])
            if as_of > self.moment:
                continue
            self.batches.append(os.path.basename(path))
            for ch in batch["changes"]:
                if ch["change"] != "results":
                    raise ValueError(f"unknown change {ch['change']} in {path}")
                c = self.contests[ch["contest"]]
                for k in ("status", "entries", "counted", "updated"):
                    if k in ch:
                        c[k] = ch[k]
                self.history[ch["contest"]].append((as_of, json.loads(json.dumps(ch))))

    # ---- names -------------------------------------------------------
    def name(self, pid):
        p = self.people[pid]
        return f"{p['given']} {p['family']}"

    def ward_name(self, cid):
        return self.wards[self.contests[cid]["discipline"]]["name"]

    def party_name(self, gid):
        return self.groups[gid]["name"]

    def party_of(self, pid):
        return self.people[pid]["group"]

    def contest_of(self, pid):
        found = [cid for cid, c in self.contests.items()
                 if any(e["competitor"] == pid for e in c["entries"])]
        assert len(found) == 1, (pid, found)
        return found[0]

    # ---- results -----------------------------------------------------
    @staticmethod
    def votes(entry):
        return int(entry["mark"].replace(",", ""))

    def ranked(self, cid):
        c = self.contests[cid]
        es = [e for e in c["entries"] if "place" in e]
        return sorted(es, key=lambda e: e["place"])

    def total(self, cid):
        return sum(self.votes(e) for e in self.ranked(cid))

    def status(self, cid):
        return self.contests[cid]["status"]

    def counted(self, cid):
        return self.contests[cid].get("counted", 0.0)

    def winner(self, cid):
        if self.status(cid) != "final":
            return None
        seat = [e for e in self.ranked(cid) if e.get("award") == "seat"]
        return seat[0]["competitor"] if seat else self.ranked(cid)[0]["competitor"]

    def leader(self, cid):
        r = self.ranked(cid)
        return r[0]["competitor"] if r else None

    def at_place(self, cid, place):
        for e in self.ranked(cid):
            if e["place"] == place:
                return e["competitor"]
        return None

    def entry(self, pid):
        cid = self.contest_of(pid)
        for e in self.ranked(cid):
            if e["competitor"] == pid:
                return e
        return None

    def lead_margin(self, cid):
        r = self.ranked(cid)
        return self.votes(r[0]) - self.votes(r[1])

    def margin_of(self, pid):
        """(margin, other): a winner's lead over 2nd; a loser's gap to the winner."""
        cid = self.contest_of(pid)
        r = self.ranked(cid)
        e = self.entry(pid)
        if e["place"] == 1:
            return self.votes(e) - self.votes(r[1]), r[1]["competitor"]
        return self.votes(r[0]) - self.votes(e), r[0]["competitor"]

    def party_entry(self, gid, cid):
        for e in self.ranked(cid):
            if self.party_of(e["competitor"]) == gid:
                return e
        return None

    def seats(self, gid, by=None):
        n = 0
        for cid in self.contests:
            if by is not None:
                snap = self.state_at(cid, by)
                if not snap or snap["status"] != "final":
                    continue
                w = [e for e in snap["entries"] if e.get("award") == "seat"][0]["competitor"]
            else:
                w = self.winner(cid)
            if w and self.party_of(w) == gid:
                n += 1
        return n

    def seat_table(self):
        rows = [(gid, self.seats(gid)) for gid in self.groups]
        rows.sort(key=lambda r: -r[1])
        return rows

    def open_contests(self):
        return [cid for cid in self.contests if self.status(cid) != "final"]

    def state_at(self, cid, when_iso_or_dt):
        when = when_iso_or_dt if isinstance(when_iso_or_dt, datetime) else datetime.fromisoformat(when_iso_or_dt)
        snap = None
        for as_of, ch in self.history[cid]:
            if as_of <= when:
                snap = ch
        return snap

    def earlier_marks(self, cid):
        """Vote figures this contest showed at earlier moments that differ from now."""
        now = {e["mark"] for e in self.ranked(cid)}
        out = []
        for _, ch in self.history[cid][:-1]:
            for e in ch["entries"]:
                if e["mark"] not in now and e["mark"] not in out:
                    out.append(e["mark"])
        return out

    def earlier_counted(self, cid):
        now = counted_text(self.counted(cid))
        out = []
        for _, ch in self.history[cid][:-1]:
            t = counted_text(ch["counted"])
            if t != now and t not in out:
                out.append(t)
        return out

    def party_votes(self, gid):
        return sum(self.votes(e) for cid in self.contests for e in self.ranked(cid)
                   if self.party_of(e["competitor"]) == gid)

    def previous_snapshot(self, cid):
        h = self.history[cid]
        return h[-2][1] if len(h) >= 2 else None

    def stale_marks(self, cid):
        """Vote figures of the snapshot before the current one that no longer hold."""
        prev = self.previous_snapshot(cid)
        if not prev:
            return []
        now = [e["mark"] for e in self.ranked(cid)]
        return [e["mark"] for e in prev["entries"] if e["mark"] not in now]

    def stale_counted(self, cid):
        prev = self.previous_snapshot(cid)
        if not prev:
            return []
        t = counted_text(prev["counted"])
        return [] if t == counted_text(self.counted(cid)) else [t]
