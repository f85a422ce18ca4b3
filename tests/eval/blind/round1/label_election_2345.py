#!/usr/bin/env python3
"""Labelling script for the blind question set: scenario election, moment 23:45.

Reads dataset-demo/election/*.json, applies the replay batches whose as_of is
at or before 2027-05-06T23:45+01:00 (batches 01-05), holds the questions with
the meaning intended for each (intent, slots, what is asked), computes every
expected fact from the data, and writes election-2345.yaml beside this file.

Python 3 standard library + PyYAML only.
"""
import json
import os
import sys
from datetime import datetime
from decimal import Decimal, ROUND_HALF_UP, ROUND_FLOOR

import yaml

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.normpath(os.path.join(HERE, "..", "..", "..", ".."))
DATA = os.path.join(ROOT, "dataset-demo", "election")
OUT = os.path.join(HERE, "election-2345.yaml")

MOMENT = datetime.fromisoformat("2027-05-06T23:45:00+01:00")
PREV_MOMENT = datetime.fromisoformat("2027-05-06T23:30:00+01:00")   # one batch earlier
NEXT_MOMENT = datetime.fromisoformat("2027-05-07T00:00:00+01:00")   # one batch later


def load(name):
    with open(os.path.join(DATA, name), encoding="utf-8") as f:
        return json.load(f)


COMPETITORS = {c["id"]: c for c in load("competitors.json")}
GROUPS = {g["id"]: g for g in load("groups.json")}
SPORTS = load("sports.json")
DISCIPLINES = {d["id"]: d for s in SPORTS for d in s["disciplines"]}
BASE_CONTESTS = load("contests.json")
REPLAY_DIR = os.path.join(DATA, "replay")
BATCHES = []
for fn in sorted(os.listdir(REPLAY_DIR)):
    if fn.endswith(".json"):
        with open(os.path.join(REPLAY_DIR, fn), encoding="utf-8") as f:
            b = json.load(f)
        BATCHES.append((fn, datetime.fromisoformat(b["as_of"]), b))


def state_at(moment):
    """Contests after applying every batch with as_of <= moment, in name order."""
    contests = {c["id"]: json.loads(json.dumps(c)) for c in BASE_CONTESTS}
    applied = []
    for fn, as_of, b in BATCHES:
        if as_of > moment:
            break
        for ch in b["changes"]:
            if ch["change"] == "results":
                c = contests[ch["contest"]]
                for key in ("status", "entries", "counted", "updated"):
                    if key in ch:
                        c[key] = ch[key]
        applied.append(fn)
    return contests, applied


S, APPLIED = state_at(MOMENT)
PREV, _ = state_at(PREV_MOMENT)
NEXT, _ = state_at(NEXT_MOMENT)
assert APPLIED == ["01-2245.json", "02-2300.json", "03-2315.json",
                   "04-2330.json", "05-2345.json"], APPLIED

# ---------------------------------------------------------------- facts


def cname(cid):
    c = COMPETITORS[cid]
    return f"{c['given']} {c['family']}"


def gname(gid):
    return GROUPS[gid]["name"]


def wname(kid):
    return DISCIPLINES[BASE_CONTESTS_BY_ID[kid]["discipline"]]["name"]


BASE_CONTESTS_BY_ID = {c["id"]: c for c in BASE_CONTESTS}


def display(i):
    if i in COMPETITORS:
        return cname(i)
    if i in GROUPS:
        return gname(i)
    return wname(i)


def votes_of(entry):
    return int(str(entry["mark"]).replace(",", ""))


def fmt_votes(n):
    return f"{n:,}"


def ordinal(n):
    if 10 <= n % 100 <= 20:
        suf = "th"
    else:
        suf = {1: "st", 2: "nd", 3: "rd"}.get(n % 10, "th")
    return f"{n}{suf}"


def ranked(st, kid):
    """Entries of a contest with votes, best first; [] if nothing counted."""
    c = st[kid]
    if c["status"] == "scheduled":
        return []
    es = [e for e in c["entries"] if "mark" in e]
    return sorted(es, key=lambda e: (e.get("place", 99), -votes_of(e)))


def total_votes(st, kid):
    return sum(votes_of(e) for e in ranked(st, kid))


def share(st, kid, cid):
    e = next(e for e in ranked(st, kid) if e["competitor"] == cid)
    pct = (Decimal(votes_of(e)) * 100 / Decimal(total_votes(st, kid))).quantize(
        Decimal("0.1"), rounding=ROUND_HALF_UP)
    return f"{pct}%"


def counted_pct(st, kid):
    c = st[kid]
    if c["status"] == "scheduled" or c.get("counted") is None:
        return None
    if c["status"] == "final":
        return "100%"
    v = (Decimal(repr(c["counted"])) * 100).to_integral_value(rounding=ROUND_FLOOR)
    return f"{v}%"


def leader(st, kid):
    r = ranked(st, kid)
    return r[0]["competitor"] if r else None


def margin(st, kid):
    r = ranked(st, kid)
    if len(r) < 2:
        return None
    return votes_of(r[0]) - votes_of(r[1])


def is_live(st, kid):
    return st[kid]["status"] == "live"


def is_final(st, kid):
    return st[kid]["status"] == "final"


def party_entry(st, gid, kid):
    """(competitor id, place, votes) of the party's candidate in the ward."""
    for i, e in enumerate(ranked(st, kid), 1):
        if COMPETITORS[e["competitor"]]["group"] == gid:
            return e["competitor"], i, votes_of(e)
    return None


def party_stands(gid, kid):
    return any(COMPETITORS[e["competitor"]]["group"] == gid
               for e in BASE_CONTESTS_BY_ID[kid]["entries"])


def seats(st):
    tally = {g: 0 for g in GROUPS}
    for kid in st:
        if is_final(st, kid):
            tally[COMPETITORS[leader(st, kid)]["group"]] += 1
    return tally


def declared_count(st):
    return sum(1 for k in st if is_final(st, k))


def open_wards(st):
    return [k for k in st if not is_final(st, k)]


def live_wards(st):
    return [k for k in st if is_live(st, k)]


def not_started(st):
    return [k for k in st if st[k]["status"] == "scheduled"]


def contest_fact_strings(st, kid):
    """Every fact string a correct reply about this ward at the moment may hold."""
    out = [wname(kid)]
    for e in ranked(st, kid):
        out += [cname(e["competitor"]), fmt_votes(votes_of(e)),
                share(st, kid, e["competitor"])]
    for x in (margin(st, kid), ):
        if x is not None:
            out.append(fmt_votes(x))
    p = counted_pct(st, kid)
    if p:
        out.append(p)
    for e in BASE_CONTESTS_BY_ID[kid]["entries"]:
        out.append(cname(e["competitor"]))
        out.append(gname(COMPETITORS[e["competitor"]]["group"]))
    return out


def safe_never(kid, candidates, minlen=3):
    """Keep a wrong-moment figure only if no correct reply could contain it."""
    facts = [f.lower() for f in contest_fact_strings(S, kid)]
    keep = []
    for c in candidates:
        if c is None:
            continue
        c = str(c)
        if len(c) < minlen:
            continue
        if any(c.lower() in f for f in facts):
            continue
        if c not in keep:
            keep.append(c)
    return keep


def prev_next_figures(kid, what, gid=None):
    """The same figure one batch earlier and one batch later (wrong moments)."""
    figs = []
    for st in (PREV, NEXT):
        if what == "margin":
            m = margin(st, kid)
            figs.append(fmt_votes(m) if m is not None else None)
        elif what == "pct":
            figs.append(counted_pct(st, kid))
        elif what == "leader_votes":
            r = ranked(st, kid)
            figs.append(fmt_votes(votes_of(r[0])) if r else None)
        elif what == "party_votes":
            pe = party_entry(st, gid, kid)
            figs.append(fmt_votes(pe[2]) if pe else None)
    return figs


# ------------------------------------------------------------- labelling

CARD = {
    "candidate_result": {"competitor", "contest"},
    "count_progress": {"contest"},
    "greeting": set(),
    "help": set(),
    "open_races": set(),
    "party_in_ward": {"group", "contest"},
    "party_seats": {"group"},
    "seat_totals": {"count"},
    "thanks": set(),
    "ward_leader": {"contest"},
    "ward_results": {"contest"},
    "ward_winner": {"contest"},
}
REQUIRED = {
    "candidate_result": {"competitor"},
    "count_progress": {"contest"},
    "party_in_ward": {"group", "contest"},
    "party_seats": {"group"},
    "ward_leader": {"contest"},
    "ward_results": {"contest"},
    "ward_winner": {"contest"},
}


def T(ask, intent, slots=None, focus=None, asks=None, tags=(), outcome=None,
      options=None, never=None, unknown=False):
    """One turn, with the meaning intended.

    asks: what is asked, beyond intent and slots: ("place", n), ("compare", a, b),
          ("votes", cid), ("share",), or None for the intent's main fact.
    outcome: forced outcome (for none, clarify, unknown names) else computed.
    options: ids of the things a clarify must name.
    never: a function of the state returning facts that must not appear.
    unknown: the question names a ward that is not in the data.
    """
    return dict(ask=ask, intent=intent, slots=dict(slots or {}), focus=focus,
                asks=asks, tags=list(tags), outcome=outcome, options=options,
                never=never, unknown=unknown)


def compute(t):
    intent, slots, asks = t["intent"], t["slots"], t["asks"]
    says, never = [], []
    outcome = t["outcome"]

    if outcome == "clarify":
        says = [display(o) for o in (t["options"] or [])]
        return outcome, says, never

    if intent == "none":
        if t["never"]:
            never = t["never"](S)
        return outcome, says, never

    if intent in ("greeting", "help", "thanks"):
        return "answered", [], []

    if t["unknown"]:
        return "no_data", [], []

    kid = slots.get("contest")

    if intent == "ward_leader":
        if not is_live(S, kid) and not is_final(S, kid):
            nv = prev_next_figures(kid, "leader_votes") + prev_next_figures(kid, "margin")
            return "no_data", [], safe_never(kid, nv)
        says = [cname(leader(S, kid)), fmt_votes(margin(S, kid))]
        never = safe_never(kid, prev_next_figures(kid, "margin"))
        return "answered", says, never

    if intent == "ward_results":
        r = ranked(S, kid)
        if not r:
            nv = prev_next_figures(kid, "leader_votes")
            return "no_data", [], safe_never(kid, nv)
        if asks is None:
            for e in r:
                says += [cname(e["competitor"]), fmt_votes(votes_of(e))]
        elif asks[0] == "place":
            n = asks[1] if asks[1] > 0 else len(r)
            e = r[n - 1]
            says = [cname(e["competitor"]), fmt_votes(votes_of(e))]
        elif asks[0] in ("compare", "votes"):
            for cid in asks[1:]:
                e = next(e for e in r if e["competitor"] == cid)
                says += [cname(cid), fmt_votes(votes_of(e))]
        never = safe_never(kid, prev_next_figures(kid, "leader_votes"))
        return "answered", says, never

    if intent == "ward_winner":
        if is_final(S, kid):
            return "answered", [cname(leader(S, kid))], []
        return "no_data", [], []

    if intent == "candidate_result":
        cid = slots["competitor"]
        kid = kid or next(c["id"] for c in BASE_CONTESTS
                          if any(e["competitor"] == cid for e in c["entries"]))
        if is_final(S, kid):
            return "answered", [cname(cid)], []
        return "no_data", [], []

    if intent == "count_progress":
        p = counted_pct(S, kid)
        if p is None:
            return "no_data", [], safe_never(kid, prev_next_figures(kid, "pct"))
        return "answered", [p], safe_never(kid, prev_next_figures(kid, "pct"))

    if intent == "party_in_ward":
        gid = slots["group"]
        if not party_stands(gid, kid):
            # the party has no candidate there: never the figures of another ward
            return "no_data", [], []
        pe = party_entry(S, gid, kid)
        if pe is None:      # standing, but counting not started
            return "no_data", [], safe_never(kid, prev_next_figures(kid, "party_votes", gid))
        cid, place, v = pe
        says = [fmt_votes(v), ordinal(place)]
        if asks and asks[0] == "share":
            says.append(share(S, kid, cid))
        never = safe_never(kid, prev_next_figures(kid, "party_votes", gid))
        return "answered", says, never

    if intent == "party_seats":
        if declared_count(S) == 0:
            return "no_data", [], []
        return "answered", [gname(slots["group"]), str(seats(S)[slots["group"]])], []

    if intent == "seat_totals":
        if declared_count(S) == 0:
            return "no_data", [], []
        tally = sorted(seats(S).items(), key=lambda kv: -kv[1])
        n = int(slots.get("count", len(tally)))
        return "answered", [gname(g) for g, _ in tally[:n]], []

    if intent == "open_races":
        return "answered", [wname(k) for k in open_wards(S)], []

    raise ValueError(intent)


def emit(t):
    outcome, says, never = compute(t)
    d = {"ask": t["ask"], "intent": t["intent"]}
    if t["intent"] != "none":
        d["slots"] = t["slots"]
    d["outcome"] = outcome
    d["focus"] = t["focus"]
    if says:
        d["says"] = says
    if never:
        d["never"] = never
    d["tags"] = t["tags"]
    return d


# ------------------------------------------------------- checks on the data

def _alias_owners(word):
    w = word.lower()
    owners = []
    for d in DISCIPLINES.values():
        if w == d["name"].lower() or w in [a.lower() for a in d["aliases"]]:
            owners.append(d["id"])
    return owners


ASHVENNY = _alias_owners("Ashvenny")
assert sorted(ASHVENNY) == ["ashvenny-north", "ashvenny-south"], ASHVENNY
BRANNICKS = sorted(c for c in COMPETITORS if COMPETITORS[c]["family"] == "Brannick")
assert BRANNICKS == ["c07", "c35"], BRANNICKS
_given = [c["given"] for c in COMPETITORS.values()]
assert len(set(_given)) == len(_given), "a given name is shared"


def cand(given_or_family):
    m = [c for c in COMPETITORS if given_or_family in
         (COMPETITORS[c]["given"], COMPETITORS[c]["family"])]
    assert len(m) == 1, (given_or_family, m)
    return m[0]


def ward_of(cid):
    return next(c["id"] for c in BASE_CONTESTS
                if any(e["competitor"] == cid for e in c["entries"]))


# ------------------------------------------------------------ the questions
# Ids written here are checked against the data below.

AN, AS_, BQ, CM = "ashvenny-north", "ashvenny-south", "brindle-quay", "caddenmill"
DV, FG, GV, LM = "dunvarrick", "fennick-green", "gorsevane", "lanmouth"
MB, PH, QC, WS = "marrowby", "pellin-heath", "quellan-cross", "wrenlow-sands"
HAL, MPR, LAN, CGR, TGI = "harbour", "moorland", "lantern", "greens", "tollgate"

NC, NU = "not_covered", "not_understood"

SINGLES = [
    # ward_leader
    T("who's ahead in ashvenny north?", "ward_leader", {"contest": AN}, "who",
      tags=["exact", "contraction"]),
    T("Whos leading in Brindle Quay rn", "ward_leader", {"contest": BQ}, "who",
      tags=["misspelling", "exact"]),
    T("who is winning in cadden mill", "ward_leader", {"contest": CM}, "who",
      tags=["voice", "mishearing"]),
    T("Is it still tight in Caddenmill between Corrigane and Fennow? what's the gap", "ward_leader",
      {"contest": CM}, "margin", tags=["partial", "chatty"]),
    T("whats the gap at the top in Dunvarick", "ward_leader", {"contest": DV}, "margin",
      tags=["misspelling", "contraction"]),
    T("whose out in front on the Heath", "ward_leader", {"contest": PH}, "who",
      tags=["misspelling", "partial", "alias"]),
    T("gorse vain whos in the lead", "ward_leader", {"contest": GV}, "who",
      tags=["voice", "mishearing"]),
    T("Fennick - who's topping the poll so far tonight?", "ward_leader", {"contest": FG}, "who",
      tags=["partial", "relative_day", "trade_word"]),
    T("lanmouth town leader + majority pls", "ward_leader", {"contest": LM}, "margin",
      tags=["alias", "trade_word"]),
    T("marrowbee whos ahead", "ward_leader", {"contest": MB}, "who",
      tags=["misspelling"]),
    T("How big is Ivo Oskary's lead at the moment?", "ward_leader", {"contest": ward_of(cand("Ivo"))},
      "margin", tags=["exact", "indirect_ward"]),
    T("is sten lusketh still out in front", "ward_leader", {"contest": ward_of(cand("Sten"))},
      "whether", tags=["voice", "indirect_ward"]),
    T("wrenlow sands who's leading", "ward_leader", {"contest": WS}, "who",
      tags=["exact", "not_started"]),
    T("Who's leading in Tamsendale East?", "ward_leader", {}, "who",
      tags=["unknown_name"], unknown=True),

    # ward_results
    T("full count in Ashvenny South please", "ward_results", {"contest": AS_}, "results",
      tags=["exact", "polite"]),
    T("Give me the Lanmouth numbers", "ward_results", {"contest": LM}, "results",
      tags=["exact"]),
    T("can i see the votes for each candidate in fennick green", "ward_results", {"contest": FG},
      "results", tags=["exact"]),
    T("pelin heath result so far", "ward_results", {"contest": PH}, "results",
      tags=["misspelling"]),
    T("whos second in gorsevane", "ward_results", {"contest": GV}, "who", asks=("place", 2),
      tags=["misspelling", "constraint"]),
    T("who's propping up the table in Caddenmill", "ward_results", {"contest": CM}, "who",
      asks=("place", 0), tags=["chatty", "constraint"]),
    T("Is Kell Thrane ahead of Mirela Stellick?", "ward_results", {"contest": LM}, "compare",
      asks=("compare", cand("Kell"), cand("Mirela")), tags=["exact", "indirect_ward"]),
    T("how many votes has Delphy Vardisse got", "ward_results", {"contest": AN}, "mark",
      asks=("votes", cand("Delphy")), tags=["exact", "indirect_ward"]),
    T("quellan cross numbers?", "ward_results", {"contest": QC}, "results",
      tags=["exact", "not_started"]),

    # ward_winner
    T("Who won Ashvenny North?", "ward_winner", {"contest": AN}, "who", tags=["exact", "not_yet"]),
    T("has brindle quay declared", "ward_winner", {"contest": BQ}, "status",
      tags=["trade_word", "not_yet"]),
    T("who took the seat in Dunvarrick", "ward_winner", {"contest": DV}, "who",
      tags=["exact", "not_yet"]),
    T("winner in wrenlow?", "ward_winner", {"contest": WS}, "who", tags=["partial", "not_yet"]),
    T("any result out of marrowby yet or", "ward_winner", {"contest": MB}, "status",
      tags=["chatty", "not_yet"]),

    # candidate_result
    T("has Orla Quenlow won?", "candidate_result", {"competitor": cand("Orla")}, "whether",
      tags=["exact", "not_yet"]),
    T("is juna tullock elected yet", "candidate_result", {"competitor": cand("Juna")}, "whether",
      tags=["exact", "not_yet"]),
    T("did rosmund get in", "candidate_result", {"competitor": cand("Rosmund")}, "whether",
      tags=["partial", "not_yet"]),
    T("has tamsin brannock won her seat", "candidate_result", {"competitor": cand("Tamsin")},
      "whether", tags=["misspelling", "not_yet"]),
    T("brannick elected?", "candidate_result", {}, "whether", outcome="clarify",
      options=BRANNICKS, tags=["ambiguous", "partial", "clarify"]),
    T("is yara glen vain in", "candidate_result", {"competitor": cand("Yara")}, "whether",
      tags=["voice", "mishearing", "not_yet"]),
    T("Has Sten Lusketh held on and won Dunvarrick?", "candidate_result",
      {"competitor": cand("Sten"), "contest": DV}, "whether", tags=["exact", "constraint", "not_yet"]),

    # count_progress
    T("how much of ashvenny north is counted", "count_progress", {"contest": AN}, "status",
      tags=["exact"]),
    T("What % counted in Caddenmill?", "count_progress", {"contest": CM}, "status",
      tags=["exact", "abbreviation"]),
    T("how far along is the count on the Sands", "count_progress", {"contest": WS}, "status",
      tags=["alias", "not_started"]),
    T("hows the count going in done varrick", "count_progress", {"contest": DV}, "status",
      tags=["voice", "mishearing"]),
    T("percentage of boxes in for Lanmouth?", "count_progress", {"contest": LM}, "status",
      tags=["trade_word"]),
    T("Have they even started counting in Quellan?", "count_progress", {"contest": QC}, "status",
      tags=["partial", "not_started"]),
    T("how much is left to count in gorsevane", "count_progress", {"contest": GV}, "status",
      tags=["exact"]),

    # party_in_ward
    T("how are the Greens doing in Fennick Green", "party_in_ward", {"group": CGR, "contest": FG},
      "how_did", tags=["exact", "confusable"]),
    T("harbour alliance in caddenmill?", "party_in_ward", {"group": HAL, "contest": CM},
      "how_did", tags=["exact", "terse"]),
    T("what's the Lantern vote looking like in Lanmouth", "party_in_ward", {"group": LAN, "contest": LM},
      "mark", tags=["alias"]),
    T("How did Tollgate do in Ashvenny North", "party_in_ward", {"group": TGI, "contest": AN},
      "how_did", tags=["alias", "party_not_standing"]),
    T("moreland progressives in marrowby how they doing", "party_in_ward",
      {"group": MPR, "contest": MB}, "how_did", tags=["misspelling", "voice"]),
    T("what share are the Independents on in Gorsevane", "party_in_ward",
      {"group": TGI, "contest": GV}, "mark", asks=("share",), tags=["alias"]),
    T("greens in brindle quay??", "party_in_ward", {"group": CGR, "contest": BQ}, "how_did",
      tags=["terse", "party_not_standing"]),

    # party_seats
    T("how many seats have Harbour got so far", "party_seats", {"group": HAL}, "count",
      tags=["alias", "not_yet"]),
    T("lanterns seat tally?", "party_seats", {"group": LAN}, "count",
      tags=["alias", "terse", "not_yet"]),
    T("has tollgate won anything yet", "party_seats", {"group": TGI}, "whether",
      tags=["alias", "not_yet"]),
    T("civic greens seats", "party_seats", {"group": CGR}, "count", tags=["voice", "not_yet"]),

    # seat_totals
    T("what's the state of the parties", "seat_totals", {}, "table", tags=["chatty", "not_yet"]),
    T("seats scoreboard", "seat_totals", {}, "table", tags=["terse", "not_yet"]),
    T("top 3 parties by seats won", "seat_totals", {"count": "3"}, "table",
      tags=["constraint", "not_yet"]),
    T("just gimme the top two on seats", "seat_totals", {"count": "2"}, "table",
      tags=["number_words", "constraint", "not_yet"]),

    # open_races
    T("which wards are still undeclared", "open_races", {}, "open", tags=["trade_word"]),
    T("what's still to come tonight?", "open_races", {}, "open", tags=["relative_day", "contraction"]),
    T("any wards called yet?", "open_races", {}, "status", tags=["trade_word"]),
    T("which races are still up for grabs", "open_races", {}, "open", tags=["chatty"]),

    # missing details and shared place words
    T("results please", "ward_results", {}, "results", outcome="clarify",
      tags=["missing_slot", "clarify", "terse"]),
    T("has she won yet?", "candidate_result", {}, "whether", outcome="clarify",
      tags=["missing_slot", "clarify", "pronoun"]),
    T("how's the Alliance getting on in Ashvenny", "party_in_ward", {"group": HAL}, "how_did",
      outcome="clarify", options=ASHVENNY, tags=["ambiguous", "clarify", "alias", "partial"]),

    # chat
    T("hi there", "greeting", {}, "chat", tags=["chatty"]),
    T("what can you actually do", "help", {}, "chat", tags=["chatty"]),
    T("evening! what kind of stuff can I ask you", "help", {}, "chat", tags=["chatty"]),
    T("cheers", "thanks", {}, "chat", tags=["chatty"]),

    # not covered
    T("what's the turnout in Ashvenny North", "none", focus="other", outcome=NC,
      tags=["uncovered", "trade_word"]),
    T("where's the Caddenmill count happening", "none", focus="where", outcome=NC,
      tags=["uncovered"]),
    T("when's Marrowby expected to declare?", "none", focus="when", outcome=NC,
      tags=["uncovered", "trade_word"]),
    T("what was the result in brindle quay last time round", "none", focus="results", outcome=NC,
      tags=["uncovered"]),
    T("whats the swing from harbour to moorland in caddenmill", "none", focus="other", outcome=NC,
      tags=["uncovered", "trade_word"]),
    T("who's leading in Caddenmill if you leave out the Moorland candidate", "none", focus="who",
      outcome=NC, tags=["uncovered", "constraint"],
      never=lambda st: [cname(leader(st, CM))]),
    T("which party has the most votes across the whole county", "none", focus="who", outcome=NC,
      tags=["uncovered"]),
    T("how old is Ilsa Rookhaven", "none", focus="other", outcome=NC, tags=["uncovered"]),
    T("is there going to be a recount in gorsevane", "none", focus="other", outcome=NC,
      tags=["uncovered", "trade_word"]),
    T("how many seats does a party need for a majority on the council", "none", focus="count",
      outcome=NC, tags=["uncovered"]),
    T("which ward is the closest race right now", "none", focus="margin", outcome=NC,
      tags=["uncovered"]),
    T("which wards havent started counting", "none", focus="open", outcome=NC,
      tags=["uncovered", "constraint"],
      never=lambda st: [wname(k) for k in live_wards(st)]),
    T("what party is Fianna Zellick", "none", focus="group_of", outcome=NC, tags=["uncovered"]),
    T("spoilt ballots in lanmouth?", "none", focus="count", outcome=NC,
      tags=["uncovered", "trade_word"]),
    T("which ward is bastien elsmyre standing in", "none", focus="where", outcome=NC,
      tags=["uncovered", "voice"]),
    T("What time does the Wrenlow Sands count start?", "none", focus="when", outcome=NC,
      tags=["uncovered"]),
    T("how many votes have the Progressives got in total county wide", "none", focus="count",
      outcome=NC, tags=["uncovered", "alias"]),
    T("whos projected to take control of the council", "none", focus="who", outcome=NC,
      tags=["uncovered"]),
    T("what did the exit poll say", "none", focus="other", outcome=NC, tags=["uncovered"]),
    T("is there a livestream of the count anywhere", "none", focus="other", outcome=NC,
      tags=["uncovered"]),
    T("play some jazz", "none", focus="other", outcome=NU, tags=["uncovered", "off_topic"]),
    T("asdf jkl;", "none", focus="other", outcome=NU, tags=["uncovered", "off_topic"]),
]

FU = "follow_up"

CONVERSATIONS = [
    ([T("evening! who's in front in Ashvenny South?", "ward_leader", {"contest": AS_}, "who",
        tags=["chatty", "exact"]),
      T("by how many votes?", "ward_leader", {"contest": AS_}, "margin", tags=[FU, "ellipsis"]),
      T("and how much of it's been counted", "count_progress", {"contest": AS_}, "status",
        tags=[FU, "pronoun", "contraction"]),
      T("has sabeth won it then", "candidate_result", {"competitor": cand("Sabeth"), "contest": AS_},
        "whether", tags=[FU, "partial", "not_yet"])],
     ["conversation"]),

    ([T("how's ashvenny looking", "ward_leader", {}, "who", outcome="clarify", options=ASHVENNY,
        tags=["ambiguous", "clarify", "partial"]),
      T("the north one", "ward_leader", {"contest": AN}, "who", tags=[FU, "answer_to_clarify"]),
      T("and the other one?", "ward_leader", {"contest": AS_}, "who", tags=[FU, "ellipsis"]),
      T("ta", "thanks", {}, "chat", tags=["chatty"])],
     ["conversation", "ambiguous"]),

    ([T("has brannick won", "candidate_result", {}, "whether", outcome="clarify", options=BRANNICKS,
        tags=["ambiguous", "clarify", "partial"]),
      T("the civic greens one", "candidate_result", {"competitor": "c07"}, "whether",
        tags=[FU, "answer_to_clarify", "not_yet"]),
      T("what about the one in Pellin Heath", "candidate_result", {"competitor": "c35"}, "whether",
        tags=[FU, "not_yet"])],
     ["conversation", "ambiguous"]),

    ([T("how are Harbour doing in Lanmouth", "party_in_ward", {"group": HAL, "contest": LM},
        "how_did", tags=["alias"]),
      T("and the Lanterns?", "party_in_ward", {"group": LAN, "contest": LM}, "how_did",
        tags=[FU, "ellipsis"]),
      T("what about them in Marrowby", "party_in_ward", {"group": LAN, "contest": MB}, "how_did",
        tags=[FU, "pronoun"]),
      T("who's ahead there", "ward_leader", {"contest": MB}, "who", tags=[FU, "pronoun"])],
     ["conversation"]),

    ([T("who's winning", "ward_leader", {}, "who", outcome="clarify",
        tags=["missing_slot", "clarify"]),
      T("dunvarrick", "ward_leader", {"contest": DV}, "who", tags=[FU, "answer_to_clarify"]),
      T("is that the tollgate guy?", "none", focus="group_of", outcome=NC,
        tags=[FU, "pronoun", "uncovered"]),
      T("ok full numbers there please", "ward_results", {"contest": DV}, "results",
        tags=[FU, "pronoun"])],
     ["conversation", "missing_slot"]),

    ([T("whos leading in brindle key", "ward_leader", {"contest": BQ}, "who",
        tags=["voice", "mishearing"]),
      T("how much of brindle key is counted", "count_progress", {"contest": BQ}, "status",
        tags=["voice", "mishearing", FU]),
      T("and the full result", "ward_results", {"contest": BQ}, "results", tags=["voice", FU, "ellipsis"])],
     ["conversation", "voice"]),

    ([T("how many seats has anyone won yet", "seat_totals", {}, "table", tags=["not_yet"]),
      T("what about the greens specifically", "party_seats", {"group": CGR}, "count",
        tags=[FU, "alias", "not_yet"]),
      T("ok which wards are still open then", "open_races", {}, "open", tags=[FU, "new_question"]),
      T("thanks thats useful", "thanks", {}, "chat", tags=["chatty", "misspelling"])],
     ["conversation"]),

    ([T("How far through the count are they in Caddenmill?", "count_progress", {"contest": CM},
        "status", tags=["exact"]),
      T("and Gorsevane", "count_progress", {"contest": GV}, "status", tags=[FU, "ellipsis"]),
      T("Fennick?", "count_progress", {"contest": FG}, "status", tags=[FU, "ellipsis", "partial"]),
      T("which of those three is the closest contest", "none", focus="margin", outcome=NC,
        tags=[FU, "uncovered"])],
     ["conversation"]),

    ([T("who is leading among the harbour candidates across all the wards", "none", focus="who",
        outcome=NC, tags=["uncovered", "constraint"]),
      T("ok just tell me how Harbour are getting on in Gorsevane", "party_in_ward",
        {"group": HAL, "contest": GV}, "how_did", tags=[FU, "new_question", "alias"]),
      T("and how big's the lead", "ward_leader", {"contest": GV}, "margin",
        tags=[FU, "contraction", "ellipsis"])],
     ["conversation"]),

    ([T("Is Juna Tullock ahead in Fennick Green?", "ward_leader", {"contest": FG}, "whether",
        tags=["exact"]),
      T("has she won it yet", "candidate_result", {"competitor": cand("Juna"), "contest": FG},
        "whether", tags=[FU, "pronoun", "not_yet"]),
      T("how old is she", "none", focus="other", outcome=NC, tags=[FU, "pronoun", "uncovered"]),
      T("what does she do for a living", "none", focus="other", outcome=NC,
        tags=[FU, "pronoun", "uncovered"])],
     ["conversation", "pronoun"]),

    ([T("hello", "greeting", {}, "chat", tags=["chatty"]),
      T("what can you do?", "help", {}, "chat", tags=["chatty"]),
      T("ok, wrenlow sands, who's ahead?", "ward_leader", {"contest": WS}, "who",
        tags=["new_question", "not_started"]),
      T("has the count even started there", "count_progress", {"contest": WS}, "status",
        tags=[FU, "pronoun", "not_started"])],
     ["conversation"]),

    ([T("what percentage of the vote have the Greens got in Ashvenny North", "party_in_ward",
        {"group": CGR, "contest": AN}, "mark", asks=("share",), tags=["exact"]),
      T("and Moorland?", "party_in_ward", {"group": MPR, "contest": AN}, "mark", asks=("share",),
        tags=[FU, "ellipsis", "alias"]),
      T("so who's top", "ward_leader", {"contest": AN}, "who", tags=[FU, "contraction"])],
     ["conversation"]),

    ([T("how is the count going in yarrowby", "count_progress", {"contest": MB}, "status",
        tags=["voice", "mishearing", "confusable"]),
      T("whos ahead in marrow by", "ward_leader", {"contest": MB}, "who", tags=["voice", "mishearing", FU]),
      T("is talia yarrowby in third", "ward_results", {"contest": MB}, "whether",
        asks=("votes", cand("Talia")), tags=["voice", FU])],
     ["conversation", "voice"]),

    ([T("fen nick green whos ahead", "ward_leader", {"contest": FG}, "who",
        tags=["voice", "mishearing"]),
      T("and where do the harbour alliance stand there", "party_in_ward",
        {"group": HAL, "contest": FG}, "how_did", tags=["voice", FU, "pronoun"]),
      T("has fenwick savrelle won", "candidate_result", {"competitor": cand("Fenwick")}, "whether",
        tags=["voice", "new_question", "confusable", "not_yet"]),
      T("how much of his ward is in", "count_progress", {"contest": ward_of(cand("Fenwick"))},
        "status", tags=["voice", FU, "pronoun"])],
     ["conversation", "voice"]),

    ([T("any declarations yet?", "open_races", {}, "status", tags=["trade_word"]),
      T("ok so what's the tightest race", "none", focus="margin", outcome=NC,
        tags=[FU, "uncovered"]),
      T("I heard Caddenmill's nip and tuck - what's the margin", "ward_leader", {"contest": CM},
        "margin", tags=["trade_word", "chatty", "contraction"]),
      T("full result there", "ward_results", {"contest": CM}, "results", tags=[FU, "pronoun"])],
     ["conversation"]),

    ([T("what's going on at Lanmouth Leisure Centre tonight", "none", focus="schedule", outcome=NC,
        tags=["uncovered", "confusable", "relative_day"]),
      T("ok then just the lanmouth ward, who's top", "ward_leader", {"contest": LM}, "who",
        tags=[FU, "new_question"]),
      T("how many votes has ilsa got", "ward_results", {"contest": LM}, "mark",
        asks=("votes", cand("Ilsa")), tags=[FU, "partial"])],
     ["conversation"]),

    ([T("Moorland Progressives seats so far?", "party_seats", {"group": MPR}, "count",
        tags=["exact", "not_yet"]),
      T("and the alliance", "party_seats", {"group": HAL}, "count", tags=[FU, "ellipsis", "alias", "not_yet"]),
      T("which party is leading in the most wards", "none", focus="who", outcome=NC,
        tags=[FU, "uncovered"]),
      T("fair enough, cheers", "thanks", {}, "chat", tags=["chatty"])],
     ["conversation"]),

    ([T("has ivo oscary won brindle quay", "candidate_result",
        {"competitor": cand("Ivo"), "contest": BQ}, "whether", tags=["voice", "mishearing", "not_yet"]),
      T("how far ahead is he", "ward_leader", {"contest": BQ}, "margin", tags=["voice", FU, "pronoun"]),
      T("whos in second", "ward_results", {"contest": BQ}, "who", asks=("place", 2),
        tags=["voice", FU, "ellipsis"])],
     ["conversation", "voice"]),

    ([T("The Heath - what's the latest?", "ward_results", {"contest": PH}, "results",
        tags=["alias"]),
      T("only eight percent counted?", "count_progress", {"contest": PH}, "status",
        tags=[FU, "number_words", "ellipsis"]),
      T("how are the Greens doing there", "party_in_ward", {"group": CGR, "contest": PH}, "how_did",
        tags=[FU, "pronoun"]),
      T("and is Quilla Brannick bottom", "ward_results", {"contest": PH}, "whether",
        asks=("votes", cand("Quilla")), tags=[FU, "exact"])],
     ["conversation"]),

    ([T("quellan cross, has it started", "count_progress", {"contest": QC}, "status",
        tags=["exact", "not_started"]),
      T("when's it meant to start", "none", focus="when", outcome=NC,
        tags=[FU, "pronoun", "uncovered"]),
      T("ok what about gorsevane - who's ahead", "ward_leader", {"contest": GV}, "who",
        tags=["new_question"]),
      T("is Pembrev close behind", "ward_leader", {"contest": GV}, "margin",
        tags=[FU, "partial"])],
     ["conversation"]),

    ([T("Full results for Fennick Green please", "ward_results", {"contest": FG}, "results",
        tags=["exact", "polite"]),
      T("thank you", "thanks", {}, "chat", tags=["thanks_between"]),
      T("now Ashvenny South please", "ward_results", {"contest": AS_}, "results",
        tags=[FU, "new_question"]),
      T("going back to Fennick, how much is counted there?", "count_progress", {"contest": FG},
        "status", tags=[FU, "return", "partial"])],
     ["conversation", "thanks_between"]),

    ([T("how much has been counted", "count_progress", {}, "status", outcome="clarify",
        tags=["missing_slot", "clarify"]),
      T("in lanmouth", "count_progress", {"contest": LM}, "status", tags=[FU, "answer_to_clarify"]),
      T("and in marrowby", "count_progress", {"contest": MB}, "status", tags=[FU, "ellipsis"])],
     ["conversation", "missing_slot"]),

    ([T("who won in Caddenmill", "ward_winner", {"contest": CM}, "who", tags=["exact", "not_yet"]),
      T("ok who's leading then", "ward_leader", {"contest": CM}, "who", tags=[FU, "ellipsis"]),
      T("and has a winner been declared in Ashvenny North", "ward_winner", {"contest": AN},
        "status", tags=[FU, "new_question", "trade_word", "not_yet"])],
     ["conversation"]),

    ([T("top three in the seat table", "seat_totals", {"count": "3"}, "table",
        tags=["number_words", "constraint", "not_yet"]),
      T("how many wards are still to declare", "open_races", {}, "count", tags=[FU, "new_question"]),
      T("and which ones havent even begun counting", "none", focus="open", outcome=NC,
        tags=[FU, "uncovered", "constraint"],
        never=lambda st: [wname(k) for k in live_wards(st)])],
     ["conversation"]),

    ([T("hey tidings", "greeting", {}, "chat", tags=["chatty"]),
      T("what sorts of questions do u answer", "help", {}, "chat", tags=["chatty", "abbreviation"]),
      T("right, how did the lanterns do in brindle quay", "party_in_ward",
        {"group": LAN, "contest": BQ}, "how_did", tags=["new_question", "alias"]),
      T("brill thanks", "thanks", {}, "chat", tags=["chatty"])],
     ["conversation"]),

    ([T("is tollgate ahead in dunvarrick", "party_in_ward", {"group": TGI, "contest": DV}, "whether",
        tags=["alias"]),
      T("by how much", "ward_leader", {"contest": DV}, "margin", tags=[FU, "ellipsis"]),
      T("and are Tollgate even standing in Wrenlow Sands", "party_in_ward",
        {"group": TGI, "contest": WS}, "whether", tags=[FU, "party_not_standing"])],
     ["conversation"]),

    ([T("has orla quin low won ashvenny north", "candidate_result",
        {"competitor": cand("Orla"), "contest": AN}, "whether", tags=["voice", "mishearing", "not_yet"]),
      T("whats her lead", "ward_leader", {"contest": AN}, "margin", tags=["voice", FU, "pronoun"]),
      T("what share is the harbour alliance on in that ward", "party_in_ward",
        {"group": HAL, "contest": AN}, "mark", asks=("share",), tags=["voice", FU, "pronoun"])],
     ["conversation", "voice"]),

    ([T("who's ahead in Tamsen Dale Central", "ward_leader", {}, "who",
        tags=["unknown_name"], unknown=True),
      T("sorry I meant Lanmouth town", "ward_leader", {"contest": LM}, "who",
        tags=[FU, "correction", "alias"])],
     ["conversation"]),

    ([T("wrenlow sands - is Joram Hestermoor winning?", "ward_leader", {"contest": WS}, "whether",
        tags=["exact", "not_started"]),
      T("what about the greens there", "party_in_ward", {"group": CGR, "contest": WS}, "how_did",
        tags=[FU, "pronoun", "not_started"]),
      T("when do they start counting", "none", focus="when", outcome=NC,
        tags=[FU, "pronoun", "uncovered"])],
     ["conversation"]),

    ([T("how are the lanterns doing in their ward", "party_in_ward", {"group": LAN}, "how_did",
        outcome="clarify", tags=["missing_slot", "clarify", "alias"]),
      T("pellin heath", "party_in_ward", {"group": LAN, "contest": PH}, "how_did",
        tags=[FU, "answer_to_clarify", "party_not_standing"]),
      T("oh are they not standing there? try caddenmill then", "party_in_ward",
        {"group": LAN, "contest": CM}, "how_did", tags=[FU, "chatty", "pronoun"])],
     ["conversation", "missing_slot"]),

    ([T("what's the result so far in Gorsevane", "ward_results", {"contest": GV}, "results",
        tags=["exact", "contraction"]),
      T("cheers mate", "thanks", {}, "chat", tags=["thanks_between", "chatty"]),
      T("and has anyone actually won a seat tonight", "seat_totals", {}, "table",
        tags=["new_question", "relative_day", "not_yet"]),
      T("what about ashvenny, how much is counted", "count_progress", {}, "status",
        outcome="clarify", options=ASHVENNY, tags=["ambiguous", "clarify", "new_question"]),
      T("south", "count_progress", {"contest": AS_}, "status", tags=[FU, "answer_to_clarify", "terse"])],
     ["conversation", "thanks_between", "ambiguous"]),
]

# ---------------------------------------------------------------- checks


def check_turn(t):
    intent = t["intent"]
    assert intent == "none" or intent in CARD, intent
    for k, v in t["slots"].items():
        assert k in CARD[intent], (t["ask"], k)
        if k == "contest":
            assert v in S, v
        elif k == "competitor":
            assert v in COMPETITORS, v
        elif k == "group":
            assert v in GROUPS, v
        elif k == "count":
            assert v.isdigit(), v
    if intent == "none":
        assert not t["slots"]
        assert t["outcome"] in (NC, NU)
    elif t["outcome"] != "clarify" and not t["unknown"]:
        missing = REQUIRED.get(intent, set()) - set(t["slots"])
        assert not missing, (t["ask"], missing)
    assert t["focus"], t["ask"]


def main():
    cases = []
    all_turns = []
    for t in SINGLES:
        check_turn(t)
        cases.append(emit(t))
        all_turns.append((t, cases[-1]))
    for turns, tags in CONVERSATIONS:
        assert 2 <= len(turns) <= 6
        conv = []
        for t in turns:
            check_turn(t)
            d = emit(t)
            conv.append(d)
            all_turns.append((t, d))
        cases.append({"conversation": conv, "tags": tags})

    asks = [t["ask"] for t, _ in all_turns]
    assert len(set(asks)) == len(asks), "duplicate ask"

    n = len(all_turns)
    unc = sum(1 for _, d in all_turns if "uncovered" in d["tags"])
    nc = sum(1 for _, d in all_turns if d["outcome"] == NC)
    header = (
        "# Blind evaluation set: scenario election, moment 23:45\n"
        "# (replay batches 01-05 applied; clock 2027-05-06T23:45+01:00).\n"
        "# Written by tests/eval/blind/round1/label_election_2345.py from\n"
        "# dataset-demo/election; every fact is computed from the data.\n"
        f"# {n} turns, {len(CONVERSATIONS)} conversations, {unc} uncovered turns.\n"
    )
    body = yaml.safe_dump(cases, sort_keys=False, allow_unicode=True, width=1000,
                          default_flow_style=None)
    with open(OUT, "w", encoding="utf-8") as f:
        f.write(header + body)

    # report
    from collections import Counter
    print(f"batches applied: {', '.join(APPLIED)}")
    print(f"turns {n}, conversations {len(CONVERSATIONS)}, singles {len(SINGLES)}, "
          f"uncovered {unc} ({100 * unc / n:.1f}%), not_covered {nc} ({100 * nc / n:.1f}%)")
    print("by intent:", dict(Counter(d["intent"] for _, d in all_turns)))
    print("by outcome:", dict(Counter(d["outcome"] for _, d in all_turns)))
    print("by focus:", dict(Counter(d["focus"] for _, d in all_turns)))
    print("by tag:", dict(Counter(tag for _, d in all_turns for tag in d["tags"]).most_common()))
    print("state of the count:")
    for kid in S:
        c = S[kid]
        if c["status"] == "scheduled":
            print(f"  {wname(kid)}: not started (start {c['start']})")
        else:
            r = ranked(S, kid)
            print(f"  {wname(kid)}: {c['status']}, {counted_pct(S, kid)} counted, "
                  f"{cname(r[0]['competitor'])} ({GROUPS[COMPETITORS[r[0]['competitor']]['group']]['code']}) "
                  f"leads by {fmt_votes(margin(S, kid))}")
    print(f"  declared: {declared_count(S)}; seats: {seats(S)}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
