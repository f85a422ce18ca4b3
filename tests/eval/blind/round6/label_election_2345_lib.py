"""Helpers for label_election_2345.py: load the election demo data, apply the
replay batches up to a moment, and compute facts in the written forms the
brief asks for (votes with thousands separators, shares to one decimal,
counted share as a whole percent rounded down, ordinals)."""

import json
import os
from decimal import Decimal, ROUND_HALF_UP, ROUND_FLOOR
from fractions import Fraction

HERE = os.path.dirname(os.path.abspath(__file__))
DATA = os.path.normpath(os.path.join(HERE, "..", "..", "..", "..", "dataset-demo", "election"))


def _load(name):
    with open(os.path.join(DATA, name), encoding="utf-8") as f:
        return json.load(f)


class Election:
    """State of the election data at one moment (ISO time with offset)."""

    def __init__(self, upto_batch_prefix_max):
        self.scenario = _load("scenario.json")
        self.sports = _load("sports.json")
        self.groups = {g["id"]: g for g in _load("groups.json")}
        self.comps = {c["id"]: c for c in _load("competitors.json")}
        self.contests = {c["id"]: dict(c) for c in _load("contests.json")}
        self.ward_names = {d["id"]: d["name"] for s in self.sports for d in s["disciplines"]}
        rdir = os.path.join(DATA, "replay")
        self.applied = []
        for fn in sorted(os.listdir(rdir)):
            if not fn.endswith(".json"):
                continue
            n = int(fn.split("-")[0])
            if n > upto_batch_prefix_max:
                continue
            with open(os.path.join(rdir, fn), encoding="utf-8") as f:
                batch = json.load(f)
            self.applied.append((fn, batch["as_of"]))
            for ch in batch["changes"]:
                if ch["change"] != "results":
                    raise ValueError("unexpected change kind %r in %s" % (ch["change"], fn))
                c = self.contests[ch["contest"]]
                for k in ("status", "entries", "counted", "updated"):
                    if k in ch:
                        c[k] = ch[k]
        self.as_of = self.applied[-1][1] if self.applied else self.scenario["as_of"]

    # --- names -------------------------------------------------------------
    def name(self, cid):
        c = self.comps[cid]
        return "%s %s" % (c["given"], c["family"])

    def party(self, gid):
        return self.groups[gid]["name"]

    def ward(self, contest):
        return self.ward_names[self.contests[contest]["discipline"]]

    def ward_of(self, cid):
        for k, c in self.contests.items():
            if any(e["competitor"] == cid for e in c["entries"]):
                return k
        raise KeyError(cid)

    def party_of(self, cid):
        return self.comps[cid]["group"]

    # --- results -----------------------------------------------------------
    def status(self, contest):
        return self.contests[contest]["status"]

    def has_figures(self, contest):
        c = self.contests[contest]
        return c["status"] in ("live", "final") and all("mark" in e for e in c["entries"])

    def standings(self, contest):
        """[(competitor id, votes int, place int)] in place order."""
        c = self.contests[contest]
        if not self.has_figures(contest):
            return []
        rows = [(e["competitor"], int(str(e["mark"]).replace(",", "")), int(e["place"])) for e in c["entries"]]
        rows.sort(key=lambda r: (r[2], -r[1]))
        # sanity: places agree with votes
        for a, b in zip(rows, rows[1:]):
            assert a[1] >= b[1], (contest, rows)
        return rows

    def total(self, contest):
        return sum(v for _, v, _ in self.standings(contest))

    def votes(self, cid):
        for c, v, p in self.standings(self.ward_of(cid)):
            if c == cid:
                return v
        return None

    def place(self, cid):
        for c, v, p in self.standings(self.ward_of(cid)):
            if c == cid:
                return p
        return None

    def at_place(self, contest, place):
        for c, v, p in self.standings(contest):
            if p == place:
                return c
        return None

    def leader(self, contest):
        s = self.standings(contest)
        return s[0][0] if s else None

    def lead_margin(self, contest):
        s = self.standings(contest)
        return s[0][1] - s[1][1] if len(s) > 1 else None

    def gap(self, cid):
        """For the leader: lead over 2nd, and 2nd's id. Otherwise: deficit to
        the leader, and the leader's id."""
        ward = self.ward_of(cid)
        s = self.standings(ward)
        if not s:
            return None, None
        if s[0][0] == cid:
            return s[0][1] - s[1][1], s[1][0]
        return s[0][1] - self.votes(cid), s[0][0]

    def share(self, cid):
        ward = self.ward_of(cid)
        return fmt_share(self.votes(cid), self.total(ward))

    def counted_pct(self, contest):
        c = self.contests[contest]
        if c["status"] == "scheduled" or "counted" not in c:
            return None
        d = (Decimal(str(c["counted"])) * 100).to_integral_value(rounding=ROUND_FLOOR)
        return "%d%%" % d

    def candidate_in(self, group, contest):
        for e in self.contests[contest]["entries"]:
            if self.comps[e["competitor"]]["group"] == group:
                return e["competitor"]
        return None

    def open_wards(self):
        return [k for k, c in self.contests.items() if c["status"] != "final"]

    def seats(self):
        t = {g: 0 for g in self.groups}
        for k, c in self.contests.items():
            if c["status"] == "final":
                t[self.party_of(self.leader(k))] += 1
        return t

    def legit_strings(self, contest):
        """Every figure a correct reply about this ward at this moment could carry."""
        out = set()
        s = self.standings(contest)
        tot = self.total(contest) if s else 0
        for c, v, p in s:
            out.add(fmt_votes(v))
            out.add(str(v))
            out.add(fmt_share(v, tot))
            out.add(ordinal(p))
        for a, b in zip(s, s[1:]):
            out.add(fmt_votes(a[1] - b[1]))
        for c, v, p in s:
            out.add(fmt_votes(s[0][1] - v))
        if s:
            out.add(fmt_votes(tot))
        pct = self.counted_pct(contest)
        if pct:
            out.add(pct)
        return out


def fmt_votes(n):
    return "{:,}".format(n)


def fmt_share(v, total):
    if not total:
        return None
    x = Decimal(Fraction(v * 100, total).numerator) / Decimal(Fraction(v * 100, total).denominator)
    return "%s%%" % x.quantize(Decimal("0.1"), rounding=ROUND_HALF_UP)


def ordinal(n):
    if 10 <= n % 100 <= 20:
        suf = "th"
    else:
        suf = {1: "st", 2: "nd", 3: "rd"}.get(n % 10, "th")
    return "%d%s" % (n, suf)


def count_word(n):
    words = ["zero", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine"]
    return words[n] if 0 <= n < 10 else str(n)


def safe_never(candidates, legit):
    """Keep only never-facts that no correct reply could contain by accident
    (not a substring of a legitimate figure, and not itself legitimate)."""
    out = []
    for x in candidates:
        if x is None:
            continue
        if not usable_never(x):
            continue
        if any(x.lower() in l.lower() for l in legit if l):
            continue
        if x not in out:
            out.append(x)
    return out


# figures that turn up in any reply for other reasons: dates, clock times
_CONTEXT = ["2027-05-06", "6 May 2027", "7 May 2027", "2027", "23:45", "22:30", "22:45",
            "23:00", "23:15", "23:30", "00:00"]


def usable_never(x):
    """A never-fact must be specific enough not to occur by accident: numbers
    need three or more digits and must not be part of a date or clock time."""
    digits = x.replace(",", "").replace("%", "").replace(".", "")
    if digits.isdigit() and len(digits) < 3:
        return False
    if any(x in c for c in _CONTEXT):
        return False
    return True
