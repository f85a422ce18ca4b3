"""Shared labelling code for the blind election sets (round 4).

Reads dataset-demo/election/, applies the replay batches up to a moment and
computes every expected fact of a question from the data.  Each question is
written as data: T(ask, intent, slots, focus, tags, ...) and the facts
(says / never / outcome) are derived here from the intent and its slots.
Standard library + PyYAML only.
"""
import glob
import json
import math
import os
from decimal import Decimal, ROUND_HALF_UP

import yaml

HERE = os.path.dirname(os.path.abspath(__file__))
DATA = os.path.normpath(os.path.join(HERE, "..", "..", "..", "..", "dataset-demo", "election"))

WORDS = {1: "one", 2: "two", 3: "three", 4: "four", 5: "five", 6: "six",
         7: "seven", 8: "eight", 9: "nine"}


def load(name):
    with open(os.path.join(DATA, name), encoding="utf-8") as f:
        return json.load(f)


def votes(mark):
    return int(str(mark).replace(",", ""))


def fmt_votes(n):
    return f"{n:,}"


def count_word(n):
    return WORDS.get(n, str(n))


def ordinal(n):
    suf = "th" if 10 <= n % 100 <= 20 else {1: "st", 2: "nd", 3: "rd"}.get(n % 10, "th")
    return f"{n}{suf}"


class Election:
    def __init__(self, batches):
        """batches: number of replay files (in name order) to apply."""
        self.competitors = {c["id"]: c for c in load("competitors.json")}
        self.groups = {g["id"]: g for g in load("groups.json")}
        sports = load("sports.json")
        self.ward_names = {d["id"]: d["name"] for s in sports for d in s["disciplines"]}
        self.contests = {}
        for c in load("contests.json"):
            self.contests[c["id"]] = dict(c)
        files = sorted(glob.glob(os.path.join(DATA, "replay", "*.json")))
        self.applied = files[:batches]
        for f in self.applied:
            with open(f, encoding="utf-8") as fh:
                batch = json.load(fh)
            for ch in batch["changes"]:
                if ch["change"] != "results":
                    raise ValueError("unknown change " + ch["change"])
                c = self.contests[ch["contest"]]
                for k in ("status", "entries", "counted", "updated"):
                    if k in ch:
                        c[k] = ch[k]
        self.as_of = json.load(open(files[batches - 1]))["as_of"] if batches else None

    # ---- basic look-ups
    def name(self, cid):
        c = self.competitors[cid]
        return f"{c['given']} {c['family']}"

    def gname(self, gid):
        return self.groups[gid]["name"]

    def wname(self, contest):
        return self.ward_names[contest]

    def ward_of(self, cid):
        for k, c in self.contests.items():
            if any(e["competitor"] == cid for e in c["entries"]):
                return k
        raise KeyError(cid)

    def status(self, contest):
        return self.contests[contest]["status"]

    def has_votes(self, contest):
        return any("mark" in e for e in self.contests[contest]["entries"])

    def standings(self, contest):
        """[(place, cid, votes)] sorted by place; [] when no votes yet."""
        c = self.contests[contest]
        if not self.has_votes(contest):
            return []
        rows = [(e["place"], e["competitor"], votes(e["mark"])) for e in c["entries"]]
        return sorted(rows)

    def total(self, contest):
        return sum(v for _, _, v in self.standings(contest))

    def share(self, contest, cid):
        tot = self.total(contest)
        for _, c, v in self.standings(contest):
            if c == cid:
                q = (Decimal(v) * 100 / Decimal(tot)).quantize(Decimal("0.1"), rounding=ROUND_HALF_UP)
                return f"{q}%"
        raise KeyError(cid)

    def counted(self, contest):
        x = self.contests[contest].get("counted")
        if x is None:
            return None
        return f"{math.floor(round(x * 100, 6))}%"

    def winner(self, contest):
        for e in self.contests[contest]["entries"]:
            if e.get("award") == "seat":
                return e["competitor"]
        return None

    def seats(self):
        s = {}
        for k in self.contests:
            w = self.winner(k)
            if w:
                g = self.competitors[w]["group"]
                s[g] = s.get(g, 0) + 1
        return s

    def open_wards(self):
        return [k for k, c in self.contests.items() if c["status"] != "final"]

    def votes_of(self, cid):
        for _, c, v in self.standings(self.ward_of(cid)):
            if c == cid:
                return v
        return None

    def place_of(self, cid):
        for p, c, _ in self.standings(self.ward_of(cid)):
            if c == cid:
                return p
        return None

    def party_candidate(self, group, contest):
        for e in self.contests[contest]["entries"]:
            if self.competitors[e["competitor"]]["group"] == group:
                return e["competitor"]
        return None

    # ---- facts per intent: returns (outcome, says, never)
    def facts(self, intent, slots, focus=None):
        s = slots or {}
        ct = s.get("contest")
        cp = s.get("competitor")
        if intent in ("greeting", "help", "thanks"):
            return "answered", [], []
        if intent == "ward_winner":
            w = self.winner(ct)
            if not w:
                return "no_data", [], []
            return "answered", [self.name(w)], []
        if intent == "ward_leader":
            st = self.standings(ct)
            if not st:
                return "no_data", [], []
            margin = st[0][2] - st[1][2]
            return "answered", [self.name(st[0][1]), fmt_votes(margin)], []
        if intent == "ward_place":
            st = self.standings(ct)
            p = int(s["place"])
            if not st or p > len(st):
                return "no_data", [], []
            row = [r for r in st if r[0] == p][0]
            says = [self.name(row[1])]
            return "answered", says, []
        if intent == "ward_results":
            st = self.standings(ct)
            if not st:
                return "no_data", [], []
            says = []
            for _, c, v in st:
                says += [self.name(c), fmt_votes(v)]
            return "answered", says, []
        if intent == "count_progress":
            x = self.counted(ct)
            if x is None:
                return "no_data", [], []
            return "answered", [x], []
        if intent == "candidate_party":
            g = self.competitors[cp]["group"]
            return "answered", [self.gname(g), self.wname(self.ward_of(cp))], []
        if intent == "candidate_result":
            ward = self.ward_of(cp)
            if self.status(ward) != "final":
                return "no_data", [], []
            return "answered", [self.name(cp)], []
        if intent == "candidate_margin":
            ward = self.ward_of(cp)
            if self.status(ward) != "final":
                return "no_data", [], []
            st = self.standings(ward)
            w = self.winner(ward)
            if cp == w:
                other = st[1]
                margin = st[0][2] - other[2]
                return "answered", [fmt_votes(margin), self.name(other[1])], []
            mine = self.votes_of(cp)
            wv = [v for _, c, v in st if c == w][0]
            return "answered", [fmt_votes(wv - mine), self.name(w)], []
        if intent == "candidates_compared":
            a, b = cp, s["rival"]
            wa, wb = self.ward_of(a), self.ward_of(b)
            assert wa == wb, "compare only within one ward"
            if not self.has_votes(wa):
                return "no_data", [], []
            ahead = a if self.place_of(a) < self.place_of(b) else b
            return "answered", [self.name(ahead)], []
        if intent == "party_in_ward":
            c = self.party_candidate(s["group"], ct)
            if c is None or not self.has_votes(ct):
                return "no_data", [], []
            return "answered", [self.name(c), fmt_votes(self.votes_of(c))], []
        if intent == "party_seats":
            n = self.seats().get(s["group"], 0)
            says = [self.gname(s["group"])]
            if n:
                says.append(count_word(n))
            return "answered", says, []
        if intent == "seat_totals":
            seats = sorted(self.seats().items(), key=lambda kv: -kv[1])
            if "count" in s:
                seats = seats[: int(s["count"])]
            says = [self.gname(g) for g, _ in seats]
            if seats:
                says.append(count_word(seats[0][1]))
            return "answered", says, []
        if intent == "open_races":
            return "answered", [self.wname(k) for k in self.open_wards()], []
        raise ValueError(intent)


def T(ask, intent, slots=None, focus=None, tags=(), outcome=None, says=None,
      never=None, clarify=None, extra_says=(), extra_never=()):
    """One turn.  intent 'none' -> outcome defaults to not_covered.
    clarify=[names] -> outcome clarify with those options in says."""
    return dict(ask=ask, intent=intent, slots=slots, focus=focus, tags=list(tags),
                outcome=outcome, says=says, never=never, clarify=clarify,
                extra_says=list(extra_says), extra_never=list(extra_never))


def C(*turns, tags=()):
    return dict(conversation=list(turns), tags=list(tags))


def build_turn(el, t):
    out = {"ask": t["ask"], "intent": t["intent"]}
    tags = list(t["tags"])
    if t["intent"] == "none":
        outcome = t["outcome"] or "not_covered"
        says = t["says"] or []
        never = t["never"] or []
    elif t["clarify"] is not None:
        outcome, says, never = "clarify", list(t["clarify"]), []
        out["slots"] = t["slots"] or {}
    else:
        outcome, says, never = el.facts(t["intent"], t["slots"], t["focus"])
        if t["outcome"]:
            outcome = t["outcome"]
        if t["says"] is not None:
            says = t["says"]
        if t["never"] is not None:
            never = t["never"]
        out["slots"] = t["slots"] or {}
    says = says + t["extra_says"]
    never = never + t["extra_never"]
    if outcome == "no_data" or (t["intent"] == "none" and outcome == "not_covered"):
        if "uncovered" not in tags:
            tags.append("uncovered")
    if outcome == "clarify" and "clarify" not in tags:
        tags.append("clarify")
    out["outcome"] = outcome
    if t["focus"]:
        out["focus"] = t["focus"]
    if says:
        out["says"] = says
    if never:
        out["never"] = never
    if tags:
        out["tags"] = tags
    return out


def build(el, cases):
    res = []
    for c in cases:
        if "conversation" in c:
            conv = [build_turn(el, t) for t in c["conversation"]]
            assert 2 <= len(conv) <= 6, conv[0]["ask"]
            item = {"conversation": conv}
            if c["tags"]:
                item["tags"] = c["tags"]
            res.append(item)
        else:
            res.append(build_turn(el, c))
    return res


def stats(cases):
    turns = convs = unc = 0
    asks = []
    for c in cases:
        ts = c["conversation"] if "conversation" in c else [c]
        if "conversation" in c:
            convs += 1
        for t in ts:
            turns += 1
            asks.append(t["ask"].lower())
            if t.get("intent") == "none" or t.get("outcome") in ("no_data", "not_covered"):
                unc += 1
    dup = {a for a in asks if asks.count(a) > 1}
    return dict(cases=len(cases), turns=turns, conversations=convs,
                uncovered=unc, share=round(100.0 * unc / turns, 1), duplicates=sorted(dup))


def write(path, header, cases):
    text = yaml.safe_dump(cases, sort_keys=False, allow_unicode=True, width=1000)
    with open(path, "w", encoding="utf-8") as f:
        f.write(header)
        f.write(text)
