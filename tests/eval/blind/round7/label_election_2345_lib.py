"""Helpers for the blind election set at 23:45 (label_election_2345.py).

Loads dataset-demo/election/, applies the replay batches up to the moment,
and builds labelled turns whose expected facts are computed from the data.
"""
import glob
import json
import math
import os

HERE = os.path.dirname(os.path.abspath(__file__))
DATA = os.path.normpath(os.path.join(HERE, "..", "..", "..", "..", "dataset-demo", "election"))


def _load(name):
    with open(os.path.join(DATA, name), encoding="utf-8") as fh:
        return json.load(fh)


class State:
    """The election data with replay batches applied up to a cut-off."""

    def __init__(self, batches):
        self.competitors = {c["id"]: c for c in _load("competitors.json")}
        self.groups = {g["id"]: g for g in _load("groups.json")}
        sports = _load("sports.json")
        self.wards = {d["id"]: d for s in sports for d in s["disciplines"]}
        self.contests = {c["id"]: c for c in _load("contests.json")}
        files = sorted(glob.glob(os.path.join(DATA, "replay", "*.json")))
        self.applied = []
        for path in files[:batches]:
            with open(path, encoding="utf-8") as fh:
                batch = json.load(fh)
            self.applied.append(os.path.basename(path))
            self.as_of = batch["as_of"]
            for ch in batch["changes"]:
                if ch["change"] != "results":
                    raise ValueError("unknown change %r" % ch["change"])
                c = self.contests[ch["contest"]]
                for key in ("status", "entries", "counted", "updated"):
                    if key in ch:
                        c[key] = ch[key]

    # ---- basic look-ups -------------------------------------------------
    def name(self, cid):
        c = self.competitors[cid]
        return "%s %s" % (c["given"], c["family"])

    def party(self, gid):
        return self.groups[gid]["name"]

    def party_of(self, cid):
        return self.competitors[cid]["group"]

    def ward(self, contest):
        return self.wards[self.contests[contest]["discipline"]]["name"]

    def contest_of(self, cid):
        hits = [k for k, c in self.contests.items()
                if any(e["competitor"] == cid for e in c["entries"])]
        assert len(hits) == 1, (cid, hits)
        return hits[0]

    def status(self, contest):
        return self.contests[contest]["status"]

    def is_live(self, contest):
        return self.status(contest) == "live"

    def is_final(self, contest):
        return self.status(contest) == "final"

    def standings(self, contest):
        """Entries as (place, competitor, votes), best first; [] if no count."""
        c = self.contests[contest]
        rows = []
        for e in c["entries"]:
            if "mark" not in e or "place" not in e:
                return []
            rows.append((int(e["place"]), e["competitor"], votes(e["mark"])))
        return sorted(rows)

    def total(self, contest):
        return sum(v for _, _, v in self.standings(contest))

    def votes_of(self, cid):
        for _, c, v in self.standings(self.contest_of(cid)):
            if c == cid:
                return v
        return None

    def place_of(self, cid):
        for p, c, _ in self.standings(self.contest_of(cid)):
            if c == cid:
                return p
        return None

    def at_place(self, contest, place):
        for p, c, _ in self.standings(contest):
            if p == place:
                return c
        return None

    def leader(self, contest):
        s = self.standings(contest)
        return s[0][1] if s else None

    def lead_margin(self, contest):
        s = self.standings(contest)
        return s[0][2] - s[1][2]

    def share(self, cid):
        contest = self.contest_of(cid)
        return "%.1f%%" % (100.0 * self.votes_of(cid) / self.total(contest))

    def counted_pct(self, contest):
        counted = self.contests[contest].get("counted")
        if counted is None:
            return None
        return "%d%%" % math.floor(counted * 100 + 1e-9)

    def party_candidate(self, gid, contest):
        for e in self.contests[contest]["entries"]:
            if self.party_of(e["competitor"]) == gid:
                return e["competitor"]
        return None

    def seats(self, gid):
        n = 0
        for k in self.contests:
            if self.is_final(k) and self.party_of(self.leader(k)) == gid:
                n += 1
        return n

    def open_contests(self):
        return [k for k in self.contests if not self.is_final(k)]

    def competitors_named(self, word):
        word = word.lower()
        return [k for k, c in self.competitors.items()
                if word in (c["given"].lower(), c["family"].lower())]

    def wards_aliased(self, word):
        word = word.lower()
        return [k for k, d in self.wards.items()
                if word in [a.lower() for a in d["aliases"]] or word == d["name"].lower()]


def votes(mark):
    return int(str(mark).replace(",", ""))


def fmt_votes(n):
    return "{:,}".format(n)


def ordinal(n):
    if 10 <= n % 100 <= 20:
        suf = "th"
    else:
        suf = {1: "st", 2: "nd", 3: "rd"}.get(n % 10, "th")
    return "%d%s" % (n, suf)


def count_word(n):
    words = ["zero", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine"]
    return words[n] if 0 <= n <= 9 else str(n)


class Builder:
    """Builds labelled turns; every `says`/`never` fact comes from the State."""

    def __init__(self, state):
        self.s = state

    @staticmethod
    def _turn(ask, intent, slots, outcome, focus, says=None, never=None, tags=None):
        t = {"ask": ask, "intent": intent}
        if intent != "none":
            t["slots"] = dict(slots or {})
        t["outcome"] = outcome
        t["focus"] = focus
        if says:
            t["says"] = list(says)
        if never:
            t["never"] = list(never)
        if tags:
            t["tags"] = list(tags)
        return t

    # ---- chat ----------------------------------------------------------
    def greeting(self, ask, tags=()):
        return self._turn(ask, "greeting", {}, "answered", "chat", tags=tags)

    def help(self, ask, tags=()):
        return self._turn(ask, "help", {}, "answered", "chat", tags=tags)

    def thanks(self, ask, tags=()):
        return self._turn(ask, "thanks", {}, "answered", "chat", tags=tags)

    # ---- not covered / not understood ------------------------------------
    def none(self, ask, focus="other", never=(), tags=(), outcome="not_covered"):
        tags = list(tags)
        if "uncovered" not in tags and outcome == "not_covered":
            tags.append("uncovered")
        return self._turn(ask, "none", None, outcome, focus, never=never, tags=tags)

    def gibberish(self, ask, tags=()):
        return self._turn(ask, "none", None, "not_understood", "other", tags=tags)

    # ---- clarify ---------------------------------------------------------
    def clarify_ward(self, ask, intent, alias, extra_slots=None, focus="who", tags=()):
        options = self.s.wards_aliased(alias)
        assert len(options) > 1, alias
        says = [self.s.ward(k) for k in options]
        return self._turn(ask, intent, extra_slots or {}, "clarify", focus, says=says,
                          tags=list(tags) + ["ambiguous", "clarify"])

    def clarify_person(self, ask, intent, word, extra_slots=None, focus="how_did", tags=()):
        options = self.s.competitors_named(word)
        assert len(options) > 1, word
        says = [self.s.name(k) for k in options]
        return self._turn(ask, intent, extra_slots or {}, "clarify", focus, says=says,
                          tags=list(tags) + ["ambiguous", "clarify"])

    def missing(self, ask, intent, slots=None, focus="who", tags=()):
        return self._turn(ask, intent, slots or {}, "clarify", focus,
                          tags=list(tags) + ["missing_slot", "clarify"])

    # ---- ward intents ----------------------------------------------------
    def ward_leader(self, ask, contest, focus="who", with_margin=True, tags=()):
        s = self.s
        if contest is None:  # a ward the data does not have
            return self._turn(ask, "ward_leader", {}, "no_data", focus, tags=tags)
        slots = {"contest": contest}
        if not s.standings(contest):
            return self._turn(ask, "ward_leader", slots, "no_data", focus,
                              tags=list(tags) + ["uncovered"])
        says = [s.name(s.leader(contest))]
        if focus == "margin":
            says = [fmt_votes(s.lead_margin(contest))]
        elif with_margin:
            says.append(fmt_votes(s.lead_margin(contest)))
        return self._turn(ask, "ward_leader", slots, "answered", focus, says=says, tags=tags)

    def ward_winner(self, ask, contest, focus="who", tags=()):
        s = self.s
        slots = {"contest": contest}
        if s.is_final(contest):
            return self._turn(ask, "ward_winner", slots, "answered", focus,
                              says=[s.name(s.leader(contest))], tags=tags)
        return self._turn(ask, "ward_winner", slots, "no_data", focus,
                          tags=list(tags) + ["uncovered"])

    def ward_place(self, ask, contest, place, with_votes=False, focus="who", never=(), tags=()):
        s = self.s
        slots = {"contest": contest, "place": str(place)}
        who = s.at_place(contest, place)
        if who is None:
            return self._turn(ask, "ward_place", slots, "no_data", focus, never=never,
                              tags=list(tags) + ["uncovered"])
        says = [s.name(who)]
        if with_votes:
            says.append(fmt_votes(s.votes_of(who)))
        return self._turn(ask, "ward_place", slots, "answered", focus, says=says,
                          never=never, tags=tags)

    def ward_results(self, ask, contest, focus="results", tags=()):
        s = self.s
        if contest is None:
            return self._turn(ask, "ward_results", {}, "no_data", focus, tags=tags)
        slots = {"contest": contest}
        rows = s.standings(contest)
        if not rows:
            return self._turn(ask, "ward_results", slots, "no_data", focus,
                              tags=list(tags) + ["uncovered"])
        says = []
        for _, c, v in rows:
            says += [s.name(c), fmt_votes(v)]
        return self._turn(ask, "ward_results", slots, "answered", focus, says=says, tags=tags)

    def count_progress(self, ask, contest, focus="status", tags=()):
        s = self.s
        slots = {"contest": contest}
        pct = s.counted_pct(contest)
        says = [pct] if pct else None
        return self._turn(ask, "count_progress", slots, "answered", focus, says=says, tags=tags)

    def open_races(self, ask, as_count=False, focus="open", tags=()):
        s = self.s
        opened = s.open_contests()
        if as_count:
            says = [count_word(len(opened))]
        else:
            says = [s.ward(k) for k in opened]
        return self._turn(ask, "open_races", {}, "answered", focus, says=says, tags=tags)

    # ---- party intents ---------------------------------------------------
    def party_in_ward(self, ask, group, contest, extra=(), focus="how_did", tags=()):
        """extra: any of 'share', 'place', 'votes' (votes is always given)."""
        s = self.s
        slots = {"group": group, "contest": contest}
        cand = s.party_candidate(group, contest)
        if cand is None or not s.standings(contest):
            return self._turn(ask, "party_in_ward", slots, "no_data", focus,
                              tags=list(tags) + ["uncovered"])
        says = [s.name(cand), fmt_votes(s.votes_of(cand))]
        if "share" in extra:
            says.append(s.share(cand))
        if "place" in extra:
            says.append(ordinal(s.place_of(cand)))
        if "name_only" in extra:
            says = [s.name(cand)]
        return self._turn(ask, "party_in_ward", slots, "answered", focus, says=says, tags=tags)

    def party_seats(self, ask, group, focus="count", tags=()):
        s = self.s
        n = s.seats(group)
        says = [count_word(n)] if n else None
        return self._turn(ask, "party_seats", {"group": group}, "answered", focus,
                          says=says, tags=tags)

    def seat_totals(self, ask, count=None, focus="table", tags=()):
        s = self.s
        slots = {"count": str(count)} if count else {}
        says = []
        for g in s.groups:
            n = s.seats(g)
            if n:
                says += [s.party(g), count_word(n)]
        return self._turn(ask, "seat_totals", slots, "answered", focus,
                          says=says or None, tags=tags)

    # ---- candidate intents -----------------------------------------------
    def candidate_party(self, ask, cid, contest_slot=False, what=("party", "ward"),
                        focus="group_of", tags=()):
        s = self.s
        if cid is None:
            return self._turn(ask, "candidate_party", {}, "no_data", focus, tags=tags)
        slots = {"competitor": cid}
        says = []
        if "party" in what:
            says.append(s.party(s.party_of(cid)))
        if "ward" in what:
            says.append(s.ward(s.contest_of(cid)))
        return self._turn(ask, "candidate_party", slots, "answered", focus, says=says, tags=tags)

    def candidate_won(self, ask, cid, contest_slot=False, focus="whether", tags=()):
        """'Has X won?' -- no_data while the ward is still counting."""
        s = self.s
        contest = s.contest_of(cid)
        slots = {"competitor": cid}
        if contest_slot:
            slots["contest"] = contest
        if s.is_final(contest):
            return self._turn(ask, "candidate_result", slots, "answered", focus,
                              says=[s.name(s.leader(contest))], tags=tags)
        return self._turn(ask, "candidate_result", slots, "no_data", focus,
                          tags=list(tags) + ["uncovered"])

    def candidate_standing(self, ask, cid, contest_slot=False, extra=(), focus="how_did",
                           tags=()):
        """'How is X doing?' while counting: their votes (and place)."""
        s = self.s
        contest = s.contest_of(cid)
        slots = {"competitor": cid}
        if contest_slot:
            slots["contest"] = contest
        if not s.standings(contest):
            return self._turn(ask, "candidate_result", slots, "no_data", focus,
                              tags=list(tags) + ["uncovered"])
        says = [fmt_votes(s.votes_of(cid))]
        if "place" in extra:
            says.append(ordinal(s.place_of(cid)))
        if "share" in extra:
            says.append(s.share(cid))
        return self._turn(ask, "candidate_result", slots, "answered", focus, says=says, tags=tags)

    def candidate_margin(self, ask, cid, contest_slot=False, focus="margin", tags=(),
                         who_only=False, won_wording=False):
        """Gap to the nearest rival (leader) or to the leader (others)."""
        s = self.s
        contest = s.contest_of(cid)
        slots = {"competitor": cid}
        if contest_slot:
            slots["contest"] = contest
        if won_wording and not s.is_final(contest):
            return self._turn(ask, "candidate_margin", slots, "no_data", focus,
                              tags=list(tags) + ["uncovered"])
        rows = s.standings(contest)
        if not rows:
            return self._turn(ask, "candidate_margin", slots, "no_data", focus,
                              tags=list(tags) + ["uncovered"])
        mine = s.votes_of(cid)
        if rows[0][1] == cid:
            says = [fmt_votes(mine - rows[1][2])]
        else:
            ahead = rows[0][1]
            says = [s.name(ahead)] if who_only else [fmt_votes(rows[0][2] - mine), s.name(ahead)]
        return self._turn(ask, "candidate_margin", slots, "answered", focus, says=says, tags=tags)

    def compared(self, ask, a, b, contest_slot=False, focus="compare", tags=()):
        s = self.s
        contest = s.contest_of(a)
        assert contest == s.contest_of(b), (a, b)
        slots = {"competitor": a, "rival": b}
        if contest_slot:
            slots["contest"] = contest
        if not s.standings(contest):
            return self._turn(ask, "candidates_compared", slots, "no_data", focus,
                              tags=list(tags) + ["uncovered"])
        ahead = a if s.place_of(a) < s.place_of(b) else b
        return self._turn(ask, "candidates_compared", slots, "answered", focus,
                          says=[s.name(ahead)], tags=tags)


def conversation(turns, tags=()):
    case = {"conversation": list(turns)}
    all_tags = list(tags)
    if all_tags:
        case["tags"] = all_tags
    return case


def single(turn, extra_tags=()):
    t = dict(turn)
    if extra_tags:
        t["tags"] = list(t.get("tags", [])) + list(extra_tags)
    return t
