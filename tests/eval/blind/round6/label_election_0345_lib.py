"""Helpers for label_election_0345.py: load the election demo data, apply the
replay batches up to the set's moment, and compute facts in the written forms
the blind-set brief asks for (votes with separators, shares to one decimal,
counted share as a whole percent rounded down, places 1st/2nd, counts 1-9 as
words, times of day on the 24-hour clock)."""

import glob
import json
import os
from decimal import Decimal, ROUND_HALF_UP, ROUND_FLOOR
from fractions import Fraction

HERE = os.path.dirname(os.path.abspath(__file__))
DATA = os.path.normpath(os.path.join(HERE, "..", "..", "..", "..", "dataset-demo", "election"))

WORDS = {1: "one", 2: "two", 3: "three", 4: "four", 5: "five",
         6: "six", 7: "seven", 8: "eight", 9: "nine"}


def _load(name):
    with open(os.path.join(DATA, name), encoding="utf-8") as f:
        return json.load(f)


class Election:
    def __init__(self, moment_iso):
        self.moment = moment_iso
        self.competitors = {c["id"]: c for c in _load("competitors.json")}
        self.groups = {g["id"]: g for g in _load("groups.json")}
        sports = _load("sports.json")
        self.ward_names = {}
        for s in sports:
            for d in s["disciplines"]:
                self.ward_names[d["id"]] = d["name"]
        base = _load("contests.json")
        self.contests = {c["id"]: dict(c) for c in base}
        self.batches = []
        for path in sorted(glob.glob(os.path.join(DATA, "replay", "*.json"))):
            with open(path, encoding="utf-8") as f:
                self.batches.append(json.load(f))
        # history[contest] = list of (as_of, snapshot) after each batch touching it
        self.history = {cid: [] for cid in self.contests}
        self.declared_at = {}
        for b in self.batches:
            if b["as_of"] > moment_iso:
                continue
            for ch in b["changes"]:
                if ch["change"] != "results":
                    raise ValueError("unexpected change kind %r" % ch["change"])
                c = self.contests[ch["contest"]]
                was_final = c.get("status") == "final"
                for k in ("status", "entries", "counted", "updated"):
                    c[k] = ch[k]
                self.history[ch["contest"]].append((b["as_of"], json.loads(json.dumps(ch))))
                if ch["status"] == "final" and not was_final:
                    self.declared_at[ch["contest"]] = ch["updated"]

    # ---- names -------------------------------------------------------
    def name(self, cid):
        c = self.competitors[cid]
        return "%s %s" % (c["given"], c["family"])

    def party_of(self, cid):
        return self.competitors[cid]["group"]

    def party_name(self, gid):
        return self.groups[gid]["name"]

    def ward(self, contest):
        return self.ward_names[contest]

    def contest_of(self, cid):
        found = [k for k, c in self.contests.items()
                 if any(e["competitor"] == cid for e in c["entries"])]
        assert len(found) == 1, (cid, found)
        return found[0]

    def family_matches(self, family):
        return [k for k, c in self.competitors.items() if c["family"].lower() == family.lower()]

    def given_matches(self, given):
        return [k for k, c in self.competitors.items() if c["given"].lower() == given.lower()]

    def ward_alias_matches(self, alias):
        out = []
        for s in _load("sports.json"):
            for d in s["disciplines"]:
                if alias.lower() in [a.lower() for a in d["aliases"]] or d["name"].lower() == alias.lower():
                    out.append(d["id"])
        return out

    # ---- results -----------------------------------------------------
    def entries(self, contest):
        c = self.contests[contest]
        return sorted(c["entries"], key=lambda e: e["place"])

    def is_final(self, contest):
        return self.contests[contest]["status"] == "final"

    @staticmethod
    def _int(mark):
        return int(mark.replace(",", ""))

    def votes(self, contest, cid):
        for e in self.contests[contest]["entries"]:
            if e["competitor"] == cid:
                return self._int(e["mark"])
        raise KeyError(cid)

    def total(self, contest):
        return sum(self._int(e["mark"]) for e in self.contests[contest]["entries"])

    def at_place(self, contest, place):
        for e in self.contests[contest]["entries"]:
            if e["place"] == place:
                return e["competitor"]
        return None

    def place_of(self, contest, cid):
        for e in self.contests[contest]["entries"]:
            if e["competitor"] == cid:
                return e["place"]
        raise KeyError(cid)

    def winner(self, contest):
        assert self.is_final(contest)
        seated = [e["competitor"] for e in self.contests[contest]["entries"] if e.get("award") == "seat"]
        assert len(seated) == 1
        assert seated[0] == self.at_place(contest, 1)
        return seated[0]

    def leader(self, contest):
        return self.at_place(contest, 1)

    def lead(self, contest):
        """Votes between 1st and 2nd."""
        return self.votes(contest, self.at_place(contest, 1)) - self.votes(contest, self.at_place(contest, 2))

    def margin_of(self, cid):
        """For the winner: lead over 2nd; for anyone else: votes behind the winner."""
        contest = self.contest_of(cid)
        if self.place_of(contest, cid) == 1:
            return self.lead(contest)
        return self.votes(contest, self.at_place(contest, 1)) - self.votes(contest, cid)

    def gap(self, contest, a, b):
        return abs(self.votes(contest, a) - self.votes(contest, b))

    def ahead(self, contest, a, b):
        return a if self.place_of(contest, a) < self.place_of(contest, b) else b

    def share(self, contest, cid):
        f = Fraction(self.votes(contest, cid) * 100, self.total(contest))
        d = (Decimal(f.numerator) / Decimal(f.denominator)).quantize(Decimal("0.1"), rounding=ROUND_HALF_UP)
        return "%s%%" % d

    def counted_pct(self, contest):
        d = (Decimal(str(self.contests[contest]["counted"])) * 100).to_integral_value(rounding=ROUND_FLOOR)
        return "%d%%" % d

    def declared_hhmm(self, contest):
        return self.declared_at[contest][11:16]

    def party_candidate(self, gid, contest):
        for e in self.contests[contest]["entries"]:
            if self.party_of(e["competitor"]) == gid:
                return e["competitor"]
        return None

    def open_contests(self):
        return [k for k, c in self.contests.items() if c["status"] != "final"]

    def seats(self, only=None):
        """Seats per party id; `only` filters contests by a predicate."""
        out = {g: 0 for g in self.groups}
        for k in self.contests:
            if not self.is_final(k):
                continue
            if only is not None and not only(k):
                continue
            out[self.party_of(self.winner(k))] += 1
        return out

    def seat_table(self):
        s = self.seats()
        return sorted(s.items(), key=lambda kv: (-kv[1], kv[0]))

    def previous_marks(self, contest):
        """Vote figures shown for the contest in the batch before its current
        state (the last live count), for `never` facts."""
        h = self.history[contest]
        if len(h) < 2:
            return []
        prev = h[-2][1]
        return [e["mark"] for e in prev["entries"]]


def votes_str(n):
    return "{:,}".format(n)


def count_word(n):
    return WORDS.get(n, str(n))


def place_str(n):
    if 10 <= n % 100 <= 20:
        suf = "th"
    else:
        suf = {1: "st", 2: "nd", 3: "rd"}.get(n % 10, "th")
    return "%d%s" % (n, suf)
