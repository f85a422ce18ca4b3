#!/usr/bin/env python3
"""Blind question set for the election scenario at 23:45.

Reads dataset-demo/election/*.json, applies the replay batches whose as_of
is not later than the moment (2027-05-06T23:45+01:00), computes every
expected fact from the data and writes election-2345.yaml next to itself.
Python 3 standard library + PyYAML.
"""
import json
import math
import os
import sys
from datetime import datetime

import yaml

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.abspath(os.path.join(HERE, "..", "..", "..", ".."))
DATA = os.path.join(ROOT, "dataset-demo", "election")
MOMENT = datetime.fromisoformat("2027-05-06T23:45:00+01:00")
OUT = os.path.join(HERE, "election-2345.yaml")


def load(name):
    with open(os.path.join(DATA, name), encoding="utf-8") as f:
        return json.load(f)


competitors = {c["id"]: c for c in load("competitors.json")}
groups = {g["id"]: g for g in load("groups.json")}
base_contests = load("contests.json")
sports = load("sports.json")
ward_names = {d["id"]: d["name"] for s in sports for d in s["disciplines"]}


def apply_batches(until):
    """State of every contest after the batches with as_of <= until."""
    state = {c["id"]: json.loads(json.dumps(c)) for c in base_contests}
    rdir = os.path.join(DATA, "replay")
    for fn in sorted(os.listdir(rdir)):
        if not fn.endswith(".json"):
            continue
        with open(os.path.join(rdir, fn), encoding="utf-8") as f:
            batch = json.load(f)
        if datetime.fromisoformat(batch["as_of"]) > until:
            continue
        for ch in batch["changes"]:
            if ch["change"] != "results":
                raise SystemExit("unexpected change kind %r" % ch["change"])
            c = state[ch["contest"]]
            for k in ("status", "entries", "counted", "updated"):
                if k in ch:
                    c[k] = ch[k]
    return state


S = apply_batches(MOMENT)
PREV = apply_batches(datetime.fromisoformat("2027-05-06T23:30:00+01:00"))
NEXT = apply_batches(datetime.fromisoformat("2027-05-07T00:00:00+01:00"))
FINAL = apply_batches(datetime.fromisoformat("2027-05-07T03:45:00+01:00"))


# ---------------------------------------------------------------- helpers
def name(cid):
    c = competitors[cid]
    return "%s %s" % (c["given"], c["family"])


def gname(gid):
    return groups[gid]["name"]


def votes(entry):
    return int(str(entry["mark"]).replace(",", ""))


def fmt_votes(n):
    return "{:,}".format(n)


def ordinal(n):
    if 10 <= n % 100 <= 20:
        suf = "th"
    else:
        suf = {1: "st", 2: "nd", 3: "rd"}.get(n % 10, "th")
    return "%d%s" % (n, suf)


def word_count(n):
    words = ["zero", "one", "two", "three", "four", "five", "six", "seven",
             "eight", "nine"]
    return words[n] if 0 <= n < 10 else str(n)


def ranked(state, ward):
    c = state[ward]
    if c["status"] == "scheduled" or not any("mark" in e for e in c["entries"]):
        return []
    return sorted(c["entries"], key=lambda e: e["place"])


def pct_counted(state, ward):
    c = state[ward]
    if "counted" not in c:
        return None
    return "%d%%" % (int(round(c["counted"] * 1000)) // 10)


def share(state, ward, cid):
    r = ranked(state, ward)
    tot = sum(votes(e) for e in r)
    v = [votes(e) for e in r if e["competitor"] == cid][0]
    return "%.1f%%" % (100.0 * v / tot)


def ward_of(cid):
    for w, c in S.items():
        if any(e["competitor"] == cid for e in c["entries"]):
            return w
    raise KeyError(cid)


def candidate_in(gid, ward):
    for e in S[ward]["entries"]:
        if competitors[e["competitor"]]["group"] == gid:
            return e["competitor"]
    return None


def is_live(ward):
    return S[ward]["status"] == "live"


def is_final(ward):
    return S[ward]["status"] in ("final", "finished", "official", "result")


def seats(state):
    t = {g: 0 for g in groups}
    for w, c in state.items():
        if is_final_state(c):
            win = sorted(c["entries"], key=lambda e: e["place"])[0]["competitor"]
            t[competitors[win]["group"]] += 1
    return t


def is_final_state(c):
    return c["status"] not in ("scheduled", "live")


def not_in(items, texts):
    """Keep only items that are not a substring of any allowed text."""
    out = []
    for i in items:
        if not any(i.lower() in t.lower() for t in texts):
            out.append(i)
    return out


# ------------------------------------------------------------- meanings
def facts(m):
    """From a meaning tuple, return (intent, slots, outcome, says, never)."""
    kind = m[0]
    if kind == "leader":
        w = m[1]
        r = ranked(S, w)
        if not r:
            nxt = [fmt_votes(votes(e)) for e in ranked(NEXT, w)]
            return "ward_leader", {"contest": w}, "no_data", [], nxt[:2]
        lead, second = r[0], r[1]
        margin = votes(lead) - votes(second)
        says = [name(lead["competitor"]), fmt_votes(margin)]
        tot = sum(votes(e) for e in r)
        allowed = says + [fmt_votes(votes(e)) for e in r] + [
            pct_counted(S, w), fmt_votes(tot), str(tot)]
        prev = ranked(PREV, w)
        never = []
        if prev:
            never.append(fmt_votes(votes(prev[0])))
        nx = ranked(NEXT, w)
        if nx:
            never.append(fmt_votes(votes(nx[0])))
        return "ward_leader", {"contest": w}, "answered", says, not_in(never, allowed)
    if kind == "place":
        w, p = m[1], m[2]
        r = ranked(S, w)
        if not r:
            return "ward_place", {"contest": w, "place": str(p)}, "no_data", [], []
        if p > len(r):
            return ("ward_place", {"contest": w, "place": str(p)}, "no_data", [],
                    [])
        e = [x for x in r if x["place"] == p][0]
        others = [name(x["competitor"]) for x in r if x["place"] != p]
        return ("ward_place", {"contest": w, "place": str(p)}, "answered",
                [name(e["competitor"])], others if m[3:] and m[3] else [])
    if kind == "results":
        w = m[1]
        r = ranked(S, w)
        if not r:
            nxt = [fmt_votes(votes(e)) for e in ranked(NEXT, w)]
            return "ward_results", {"contest": w}, "no_data", [], nxt
        says = []
        for e in r:
            says.append(name(e["competitor"]))
            says.append(fmt_votes(votes(e)))
        if len(m) > 2 and m[2] == "shares":
            says += [share(S, w, e["competitor"]) for e in r]
        tot = sum(votes(e) for e in r)
        allowed = says + [pct_counted(S, w), fmt_votes(tot), str(tot),
                          fmt_votes(votes(r[0]) - votes(r[1]))]
        never = [fmt_votes(votes(e)) for e in ranked(PREV, w)]
        never += [fmt_votes(votes(e)) for e in ranked(NEXT, w)]
        return "ward_results", {"contest": w}, "answered", says, not_in(never, allowed)
    if kind == "winner":
        w = m[1]
        if is_final(w):
            win = ranked(S, w)[0]["competitor"]
            return "ward_winner", {"contest": w}, "answered", [name(win)], []
        # no seat is declared: a correct reply may still name the leader,
        # so no name is forbidden here
        return "ward_winner", {"contest": w}, "no_data", [], []
    if kind == "progress":
        w = m[1]
        p = pct_counted(S, w)
        if S[w]["status"] == "scheduled":
            nx = pct_counted(NEXT, w)
            return "count_progress", {"contest": w}, None, [], [nx] if nx else []
        never = []
        for st in (PREV, NEXT):
            q = pct_counted(st, w)
            if q and q != p and len(q) >= 3 and q not in p:
                never.append(q)
        return "count_progress", {"contest": w}, "answered", [p], never
    if kind == "party":
        c = m[1]
        w = ward_of(c)
        never = [gname(g) for g in groups if g != competitors[c]["group"]]
        return ("candidate_party", {"competitor": c}, "answered",
                [gname(competitors[c]["group"]), ward_names[w]], never)
    if kind == "cresult":
        c = m[1]
        w = ward_of(c)
        slots = {"competitor": c}
        if len(m) > 2 and m[2]:
            slots["contest"] = m[2]
        if is_final(w):
            won = ranked(S, w)[0]["competitor"] == c
            return "candidate_result", slots, "answered", [], []
        return "candidate_result", slots, "no_data", [], []
    if kind == "cmargin":
        c = m[1]
        slots = {"competitor": c}
        if len(m) > 2 and m[2]:
            slots["contest"] = m[2]
        w = ward_of(c)
        fin = ranked(FINAL, w)
        never = []
        if fin:
            a = [e for e in fin if e["competitor"] == c][0]
            other = fin[1] if fin[0]["competitor"] == c else fin[0]
            never = [fmt_votes(abs(votes(a) - votes(other)))]
        allowed = [fmt_votes(votes(e)) for e in ranked(S, w)]
        cur = ranked(S, w)
        if len(cur) > 1:
            allowed.append(fmt_votes(votes(cur[0]) - votes(cur[1])))
        return "candidate_margin", slots, "no_data", [], not_in(never, allowed)
    if kind == "compare":
        a, b = m[1], m[2]
        slots = {"competitor": a, "rival": b}
        if len(m) > 3 and m[3]:
            slots["contest"] = m[3]
        w = ward_of(a)
        assert ward_of(b) == w, (a, b)
        r = ranked(S, w)
        if not r:
            return "candidates_compared", slots, "no_data", [], []
        va = [votes(e) for e in r if e["competitor"] == a][0]
        vb = [votes(e) for e in r if e["competitor"] == b][0]
        ahead = a if va > vb else b
        return "candidates_compared", slots, "answered", [name(ahead)], []
    if kind == "pward":
        g, w = m[1], m[2]
        slots = {"group": g, "contest": w}
        c = candidate_in(g, w)
        if c is None:
            others = [name(e["competitor"]) for e in ranked(S, w)]
            return "party_in_ward", slots, "no_data", [], []
        if not ranked(S, w):
            return "party_in_ward", slots, "no_data", [], []
        e = [x for x in ranked(S, w) if x["competitor"] == c][0]
        return ("party_in_ward", slots, "answered",
                [name(c), fmt_votes(votes(e)), ordinal(e["place"])], [])
    if kind == "pseats":
        g = m[1]
        n = seats(S)[g]
        # no seat is declared at this moment: the answer is none so far
        return "party_seats", {"group": g}, None, [], []
    if kind == "totals":
        slots = {"count": str(m[1])} if len(m) > 1 and m[1] else {}
        return "seat_totals", slots, None, [], []
    if kind == "open":
        open_w = [ward_names[w] for w, c in S.items() if not is_final_state(c)]
        return "open_races", {}, "answered", open_w, []
    if kind in ("greeting", "thanks", "help"):
        return kind, {}, "answered", [], []
    if kind == "none":
        return "none", None, "not_covered", [], list(m[1]) if len(m) > 1 else []
    if kind == "nu":
        return "none", None, "not_understood", [], []
    if kind == "clarify":
        intent, slots, opts = m[1], m[2], m[3]
        return intent, slots, "clarify", opts, []
    if kind == "nodata":
        intent, slots = m[1], m[2]
        return intent, slots, "no_data", [], list(m[3]) if len(m) > 3 else []
    raise ValueError(m)


DEFAULT_FOCUS = {
    "leader": "who", "place": "who", "results": "results", "winner": "who",
    "progress": "status", "party": "group_of", "cresult": "whether",
    "cmargin": "margin", "compare": "compare", "pward": "how_did",
    "pseats": "count", "totals": "table", "open": "open", "greeting": "chat",
    "thanks": "chat", "help": "chat", "none": "other", "nu": "other",
}


def turn(ask, m, tags, focus=None, extra_says=(), extra_never=()):
    return {"ask": ask, "m": m, "tags": list(tags), "focus": focus,
            "extra_says": list(extra_says), "extra_never": list(extra_never)}


def conv(turns, tags):
    return {"conversation": turns, "tags": list(tags)}


T = turn
N = lambda *nv: ("none",) + ((tuple(nv),) if nv else ())

# names used in clarify options
ASH = [ward_names["ashvenny-north"], ward_names["ashvenny-south"]]
BRANNICK = [name("c07"), name("c35")]

# ------------------------------------------------------------- questions
AN, AS, BQ, CM = "ashvenny-north", "ashvenny-south", "brindle-quay", "caddenmill"
DV, FG, GV, LM = "dunvarrick", "fennick-green", "gorsevane", "lanmouth"
MB, PH, QC, WS = "marrowby", "pellin-heath", "quellan-cross", "wrenlow-sands"


def lead_facts(state, w):
    """Leader's votes and lead in a state (for 'wrong moment' checks)."""
    r = ranked(state, w)
    return fmt_votes(votes(r[0])), fmt_votes(votes(r[0]) - votes(r[1]))


def margin_now(w):
    return lead_facts(S, w)[1]


AT_2300 = apply_batches(datetime.fromisoformat("2027-05-06T23:00:00+01:00"))

CASES = [
    # ---------------------------------------------------------- singles
    T("who's ahead in ashvenny north right now", ("leader", AN), ["exact", "contraction"]),
    T("caddenmill whos leading", ("leader", CM), ["exact", "contraction"]),
    T("how big is the lead in fennick green", ("leader", FG), ["exact"], focus="margin"),
    T("whos winning down at the quay", ("leader", BQ), ["partial", "contraction"]),
    T("wrenlow sands who's in front", ("leader", WS), ["exact", "contraction"]),
    T("lead in dunvarick?", ("leader", DV), ["misspelling"], focus="margin"),
    T("hi there, could you tell me who is currently top of the count in Gorsevane please?",
      ("leader", GV), ["chatty", "exact"]),
    T("ashveny north leader", ("leader", AN), ["misspelling"]),
    T("who's in front in pelin heath", ("leader", PH), ["misspelling", "contraction"]),
    T("kwellan cross who is winning", ("leader", QC), ["voice", "mishearing"]),
    T("who is leading in lan mouth", ("leader", LM), ["voice", "mishearing"]),
    T("whos top in fennick green and by how much", ("leader", FG), ["exact"], focus="margin"),
    T("Who is second in Lanmouth?", ("place", LM, 2), ["exact"]),
    T("who's in third place in brindle quay", ("place", BQ, 3), ["exact", "contraction"]),
    T("who is currently last in ashvenny south", ("place", AS, 4), ["exact", "last_place"]),
    T("who's fourth in marrowby", ("place", MB, 4), ["exact", "number_words"]),
    T("second place in dunvarrick", ("place", DV, 2), ["exact"]),
    T("caddenmill 2nd place?", ("place", CM, 2), ["exact"]),
    T("who is in third in the heath", ("place", PH, 3), ["partial"]),
    T("full results pellin heath", ("results", PH), ["exact"]),
    T("give me the numbers for caddenmill", ("results", CM), ["exact"]),
    T("marrowby results with percentages please", ("results", MB, "shares"), ["exact"]),
    T("show me the count in quellan cross", ("results", QC), ["exact"]),
    T("ashvenny south results", ("results", AS), ["exact", "voice"]),
    T("what are the votes looking like in Wrenlow", ("results", WS), ["partial"]),
    T("has anyone won ashvenny north yet", ("winner", AN), ["exact"], focus="whether"),
    T("who won lanmouth", ("winner", LM), ["exact"]),
    T("who took the seat in gorse vane", ("winner", GV), ["voice", "mishearing"]),
    T("whos the new councillor for dunvarrick", ("winner", DV), ["exact", "contraction"]),
    T("how much of the vote is counted in brindle quay", ("progress", BQ), ["exact"]),
    T("how far along is the count in ashvenny south", ("progress", AS), ["exact"]),
    T("percentage counted fennick", ("progress", FG), ["partial"]),
    T("has counting started in quellan cross yet", ("progress", QC), ["exact"]),
    T("wren low sands count", ("progress", WS), ["voice", "mishearing"]),
    T("is gorsevane nearly done counting", ("progress", GV), ["exact", "chatty"]),
    T("what party is orla quenlow", ("party", "c01"), ["exact"]),
    T("which party does Nevin Corrigane represent?", ("party", "c12"), ["exact"]),
    T("is sten lusketh one of the independents", ("party", "c16"), ["exact"]),
    T("what ward is hesper ambrell standing in", ("party", "c15"), ["exact"], focus="where"),
    T("mirela stellick party", ("party", "c27"), ["exact"]),
    T("what party's odile yellmer with", ("party", "c03"), ["exact", "contraction"]),
    T("torvane's party?", ("party", "c06"), ["partial"]),
    T("is madoc quaddle a progressive", ("party", "c25"), ["exact"]),
    T("who is fianna zelick standing for", ("party", "c33"), ["misspelling"]),
    T("has orla quenlow won", ("cresult", "c01"), ["exact"]),
    T("did kell thrane win his seat", ("cresult", "c28"), ["exact"]),
    T("has ivo oskary won brindle quay", ("cresult", "c09", BQ), ["exact"]),
    T("by how much did nevin corrigane win", ("cmargin", "c12"), ["exact"]),
    T("how much did aldo orrick lose by", ("cmargin", "c23"), ["exact"]),
    T("is juna tullock ahead of pim wystrel", ("compare", "c19", "c20"), ["exact"], focus="whether"),
    T("who's doing better in caddenmill, corrigane or fennow", ("compare", "c12", "c13", CM),
      ["partial"]),
    T("rosmund vossery or vesna whitmarren whos ahead", ("compare", "c30", "c31"), ["exact"]),
    T("is delphy vardisse beating orla", ("compare", "c02", "c01"), ["partial"], focus="whether"),
    T("how are the greens doing in fennick green", ("pward", "greens", FG), ["partial"]),
    T("how did harbour do in caddenmill", ("pward", "harbour", CM), ["partial"]),
    T("lantern party votes in lanmouth", ("pward", "lantern", LM), ["exact"]),
    T("how are the tollgate lot doing in marrowby", ("pward", "tollgate", MB), ["partial", "chatty"]),
    T("hows the lantern party getting on in brindle key", ("pward", "lantern", BQ),
      ["voice", "mishearing"]),
    T("how many seats has harbour alliance won", ("pseats", "harbour"), ["exact"]),
    T("seat totals", ("totals",), ["exact"]),
    T("top three parties by seats", ("totals", 3), ["number_words"]),
    T("which races are still undecided", ("open",), ["exact"]),
    T("what wards havent declared yet", ("open",), ["contraction"]),
    T("hello", ("greeting",), ["exact"]),
    T("what can you do", ("help",), ["exact"]),
    T("thanks a lot", ("thanks",), ["exact"]),
    # uncovered singles
    T("what's the turnout in ashvenny north", N(), ["uncovered"]),
    T("how many people are registered to vote in marrowby", N(), ["uncovered"], focus="count"),
    T("who won caddenmill last time round", N(), ["uncovered"], focus="who"),
    T("how old is orla quenlow", N(), ["uncovered"]),
    T("when is marrowby expected to declare", N(), ["uncovered"], focus="when"),
    T("where are they counting the dunvarrick votes", N(), ["uncovered"], focus="where"),
    T("total votes for harbour across the whole county", N(), ["uncovered"], focus="mark"),
    T("who leads the moorland progressives as a party", N(), ["uncovered"], focus="who"),
    T("how many seats do you need for a majority on the council", N(), ["uncovered"], focus="count"),
    T("whats the swing from harbour to moorland", N(), ["uncovered"]),
    T("is there going to be a recount in caddenmill", N(), ["uncovered"]),
    T("how many spoilt ballots in lanmouth", N(), ["uncovered"], focus="count"),
    T("what did the exit poll say", N(), ["uncovered"]),
    T("who was ahead in ashvenny north at eleven o'clock", N(*lead_facts(S, AN)),
      ["uncovered", "constraint", "number_words"], focus="who"),
    T("who's leading on the postal votes in caddenmill", N(name("c12")),
      ["uncovered", "constraint"], focus="who"),
    T("what are the civic greens promising on housing", N(), ["uncovered"]),
    T("email address for sten lusketh?", N(), ["uncovered"]),
    T("which candidate has the most votes in the whole county", N(), ["uncovered"], focus="mark"),
    T("whats the vote share for the lanterns countywide", N(), ["uncovered"], focus="mark"),
    T("how many candidates are standing altogether", N(), ["uncovered"], focus="count"),
    T("asdf jkl;", ("nu",), ["uncovered"]),
    T("whats a good recipe for banana bread", ("nu",), ["uncovered"]),
]

CL = lambda intent, slots, opts=(): ("clarify", intent, slots, list(opts))

CASES += [
    # ---------------------------------------------------- conversations
    conv([
        T("who's leading in ashvenny", CL("ward_leader", {}, ASH), ["partial", "ambiguous"], focus="who"),
        T("south", ("leader", AS), ["follow_up", "ellipsis"]),
        T("and the north one?", ("leader", AN), ["follow_up", "ellipsis"]),
        T("cheers", ("thanks",), ["thanks_between"]),
    ], ["ambiguous", "clarify", "follow_up"]),
    conv([
        T("what party is brannick in", CL("candidate_party", {}, BRANNICK), ["partial", "ambiguous"],
          focus="group_of"),
        T("the one standing in pellin heath", ("party", "c35"), ["follow_up"]),
        T("has she won there", ("cresult", "c35", PH), ["pronoun", "follow_up"]),
    ], ["ambiguous", "clarify", "pronoun"]),
    conv([
        T("who's winning?", CL("ward_leader", {}), ["missing_slot"], focus="who"),
        T("lanmouth", ("leader", LM), ["follow_up", "ellipsis"]),
        T("how much has been counted there", ("progress", LM), ["follow_up", "pronoun"]),
        T("whos second", ("place", LM, 2), ["follow_up", "ellipsis"]),
    ], ["missing_slot", "clarify", "follow_up"]),
    conv([
        T("how much of the count is done", CL("count_progress", {}), ["missing_slot"], focus="status"),
        T("in marrowby", ("progress", MB), ["follow_up", "ellipsis"]),
        T("who's ahead", ("leader", MB), ["follow_up", "ellipsis"]),
        T("full numbers please", ("results", MB), ["follow_up", "ellipsis"]),
    ], ["missing_slot", "clarify", "follow_up"]),
    conv([
        T("who came third", CL("ward_place", {"place": "3"}), ["missing_slot"], focus="who"),
        T("pellin heath", ("place", PH, 3), ["follow_up", "ellipsis"]),
        T("and first?", ("place", PH, 1), ["follow_up", "ellipsis"]),
    ], ["missing_slot", "clarify", "follow_up"]),
    conv([
        T("how are the greens doing in ashvenny south", ("pward", "greens", AS), ["partial"]),
        T("and in caddenmill", ("pward", "greens", CM), ["follow_up", "ellipsis"]),
        T("what about dunvarrick", ("pward", "greens", DV), ["follow_up", "ellipsis"]),
        T("ok how many seats have they won overall", ("pseats", "greens"), ["follow_up", "pronoun"]),
    ], ["follow_up", "pronoun"]),
    conv([
        T("which party is juna tullock", ("party", "c19"), ["exact"]),
        T("who's leading fennick green", ("leader", FG), ["new_question"]),
        T("by how much", ("leader", FG), ["follow_up", "ellipsis"], focus="margin"),
        T("has tullock won it yet", ("cresult", "c19", FG), ["follow_up", "partial", "pronoun"]),
    ], ["follow_up", "new_question"]),
    conv([
        T("is sabeth pellagan ahead of gaspard torvane", ("compare", "c05", "c06"), ["exact"],
          focus="whether"),
        T("what about tamsin brannick v rhosyn dretholm", ("compare", "c07", "c08"), ["follow_up"]),
        T("great thanks", ("thanks",), ["thanks_between"]),
    ], ["follow_up"]),
    conv([
        T("who's leading in dunvarrick", ("leader", DV), ["exact"]),
        T("what's the turnout there", N(), ["follow_up", "pronoun"]),
        T("ok which party is the person in front", ("party", "c16"), ["follow_up", "pronoun"]),
        T("how far is the count", ("progress", DV), ["follow_up", "ellipsis"]),
    ], ["follow_up", "uncovered"]),
    conv([
        T("how many seats have moorland got", ("pseats", "moorland"), ["partial"]),
        T("and the alliance", ("pseats", "harbour"), ["follow_up", "partial"]),
        T("which wards are still counting", ("open",), ["new_question"]),
        T("ty", ("thanks",), ["thanks_between"]),
    ], ["follow_up"]),
    conv([
        T("who is ahead in cadden mill", ("leader", CM), ["voice", "mishearing"]),
        T("how close is it", ("leader", CM), ["voice", "follow_up"], focus="margin"),
        T("what percent is in", ("progress", CM), ["voice", "follow_up", "ellipsis"]),
        T("who is third", ("place", CM, 3), ["voice", "follow_up", "ellipsis"]),
    ], ["voice", "follow_up"]),
    conv([
        T("hey", ("greeting",), ["exact"]),
        T("what sort of things can i ask you", ("help",), ["chatty"]),
        T("who's ahead in the sands", ("leader", WS), ["partial"]),
        T("ok what about gorsevane then", ("leader", GV), ["follow_up"]),
    ], ["chatty", "follow_up"]),
    conv([
        T("full results brindle quay", ("results", BQ), ["exact"]),
        T("what percentage has been counted", ("progress", BQ), ["follow_up", "ellipsis"]),
        T("whos last", ("place", BQ, 3), ["follow_up", "ellipsis", "last_place"]),
        T("which party's that one", ("party", "c11"), ["follow_up", "pronoun"]),
    ], ["follow_up", "pronoun"]),
    conv([
        T("how did harbour do in lanmouth", ("pward", "harbour", LM), ["partial"]),
        T("how does that compare with 2022", N(), ["follow_up"], focus="compare"),
        T("and the lanterns there?", ("pward", "lantern", LM), ["follow_up", "partial"]),
    ], ["follow_up", "uncovered"]),
    conv([
        T("has tove inglemarsh won", ("cresult", "c42"), ["exact"]),
        T("has the count even started in her ward", ("progress", WS), ["follow_up", "pronoun"]),
        T("which party is she with", ("party", "c42"), ["follow_up", "pronoun"]),
    ], ["follow_up", "pronoun"]),
    conv([
        T("ashvenny south whos second", ("place", AS, 2), ["exact"]),
        T("and who's leading", ("leader", AS), ["follow_up", "ellipsis"]),
        T("how much counted so far", ("progress", AS), ["follow_up", "ellipsis"]),
    ], ["follow_up"]),
    conv([
        T("what party is delfy vardis", ("party", "c02"), ["voice", "mishearing"]),
        T("is she beating orla quinlow", ("compare", "c02", "c01"), ["voice", "mishearing", "pronoun"],
          focus="whether"),
        T("who's third in that ward", ("place", AN, 3), ["follow_up", "pronoun"]),
    ], ["voice", "pronoun"]),
    conv([
        T("whats going on in gorsevane", ("results", GV), ["chatty"]),
        T("how tight is it at the top", ("leader", GV), ["follow_up"], focus="margin"),
        T("is that close enough for a recount", N(), ["follow_up"], focus="whether"),
        T("who's the tollgate candidate there", ("pward", "tollgate", GV), ["follow_up"], focus="who"),
    ], ["follow_up", "uncovered"]),
    conv([
        T("how are the progressives doing in quellan cross", ("pward", "moorland", QC), ["partial"]),
        T("has it even started", ("progress", QC), ["follow_up", "pronoun"]),
        T("when does it start then", N(), ["follow_up"], focus="when"),
    ], ["follow_up", "uncovered"]),
    conv([
        T("who's top in marrowby", ("leader", MB), ["exact"]),
        T("thanks!", ("thanks",), ["thanks_between"]),
        T("and in pellin heath?", ("leader", PH), ["follow_up", "ellipsis"]),
        T("full result there please", ("results", PH), ["follow_up", "pronoun"]),
    ], ["thanks_between", "follow_up"]),
    conv([
        T("is ulric fennow ahead of nevin corrigane", ("compare", "c13", "c12"), ["exact"],
          focus="whether"),
        T("who's third in caddenmill", ("place", CM, 3), ["new_question"]),
        T("what party is that", ("party", "c14"), ["follow_up", "pronoun"]),
    ], ["follow_up", "pronoun"]),
    conv([
        T("who's going to end up running the council", N(), ["chatty"], focus="who"),
        T("ok which races are still open then", ("open",), ["follow_up"]),
        T("how many seats has lantern won so far", ("pseats", "lantern"), ["new_question"]),
    ], ["uncovered", "new_question"]),
    conv([
        T("what party is kesia carravine", ("party", "c36"), ["exact"]),
        T("what about caelan dunstreth", ("party", "c37"), ["follow_up"]),
        T("and bastien elsmyre", ("party", "c38"), ["follow_up"]),
        T("are they all up against each other", N(), ["follow_up", "pronoun"]),
    ], ["follow_up", "uncovered"]),
    conv([
        T("hiya whos winning fenick green", ("leader", FG), ["misspelling", "chatty"]),
        T("whos in 2nd", ("place", FG, 2), ["follow_up", "ellipsis"]),
        T("what party's that", ("party", "c20"), ["follow_up", "pronoun"]),
        T("how's the harbour candidate there doing", ("pward", "harbour", FG), ["follow_up", "pronoun"]),
    ], ["follow_up", "pronoun"]),
    conv([
        T("how many seats does each party have", ("totals",), ["exact"]),
        T("just the top two", ("totals", 2), ["follow_up", "number_words"]),
        T("and the greens?", ("pseats", "greens"), ["follow_up", "partial"]),
    ], ["follow_up"]),
    conv([
        T("who won ashvenny north", ("winner", AN), ["exact"]),
        T("who's leading then", ("leader", AN), ["follow_up"]),
        T("how much is counted", ("progress", AN), ["follow_up", "ellipsis"]),
    ], ["follow_up"]),
    conv([
        T("marrowby is the alliance ahead", ("pward", "harbour", MB), ["partial"], focus="whether"),
        T("who's beating them", ("leader", MB), ["follow_up", "pronoun"]),
    ], ["follow_up", "pronoun"]),
    conv([
        T("lanmouth results", ("results", LM), ["exact"]),
        T("can you order me a taxi home", ("nu",), ["new_question"]),
        T("who's 4th there", ("place", LM, 4), ["follow_up", "pronoun"]),
    ], ["follow_up", "uncovered"]),
    conv([
        T("who is leading in brindle quay", ("leader", BQ), ["exact"]),
        T("and on postal votes only?", N(margin_now(BQ), name("c09")), ["follow_up", "constraint"],
          focus="who"),
    ], ["follow_up", "constraint", "uncovered"]),
    conv([
        T("how many wards are there in total", N(), ["exact"], focus="count"),
        T("which ones havent finished", ("open",), ["follow_up", "contraction"]),
    ], ["follow_up", "uncovered"]),
]


CASES += [
    # ------------------------------------------------- more singles
    T("who is in second place in ashvenny north", ("place", AN, 2), ["exact"]),
    T("who's leading in lanmouth town", ("leader", LM), ["partial"]),
    T("tonight's count in dunvarrick, who's on top", ("leader", DV), ["relative_day", "chatty"]),
    T("whats rhosyn dretholms party", ("party", "c08"), ["contraction"]),
    T("is perrin farrowgate standing for tollgate", ("party", "c39"), ["partial"]),
    T("Has Sten Lusketh won Dunvarrick?", ("cresult", "c16", DV), ["exact"]),
    T("did joram hestermoor get elected", ("cresult", "c41"), ["exact"]),
    T("how much did fenwick savrelle lose by", ("cmargin", "c18"), ["exact"]),
    T("is ilsa rookhaven beating mirela stellick in lanmouth", ("compare", "c26", "c27", LM),
      ["exact"], focus="whether"),
    T("talia yarrowby vs vesna whitmarren", ("compare", "c32", "c31"), ["exact"]),
    T("what percentage of votes are counted in pellin heath", ("progress", PH), ["exact"]),
    T("how far through is dunvarrick", ("progress", DV), ["exact"]),
    T("seats won so far by the civic greens", ("pseats", "greens"), ["exact"]),
    T("whats the seat count for tollgate independents", ("pseats", "tollgate"), ["exact"]),
    T("give me the top 5 in the seat table", ("totals", 5), ["exact"]),
    T("what's still to be decided", ("open",), ["contraction"]),
    T("how is MPR doing in gorsevane", ("pward", "moorland", GV), ["abbreviation"]),
    T("how many votes for the toll gate independents in ashvenny south", ("pward", "tollgate", AS),
      ["voice", "mishearing"], focus="mark"),
    T("quenlow or vardisse who's in the lead", ("compare", "c01", "c02"), ["partial"]),
    # uncovered
    T("which ward has the closest race right now", N(), ["uncovered"], focus="margin"),
    T("how many wards is harbour leading in", N(), ["uncovered"], focus="count"),
    T("what time will the last result come in", N(), ["uncovered"], focus="when"),
    T("who's the returning officer for lanmouth", N(), ["uncovered"], focus="who"),
    T("can i still go and vote", N(), ["uncovered"]),
    T("how many votes have been counted across the county so far", N(), ["uncovered"],
      focus="count"),
    T("who is the youngest candidate standing", N(), ["uncovered"], focus="who"),
    T("how many women are standing for the council", N(), ["uncovered"], focus="count"),
    # ------------------------------------------- more conversations
    conv([
        T("how are the TGI doing in gorsevane", ("pward", "tollgate", GV), ["abbreviation"]),
        T("the CGR?", ("pward", "greens", GV), ["follow_up", "abbreviation", "ellipsis"]),
        T("whos top there", ("leader", GV), ["follow_up", "pronoun"]),
    ], ["follow_up", "abbreviation"]),
    conv([
        T("whos ahead in ashvenny south", ("leader", AS), ["exact", "contraction"]),
        T("different question, what party is ilsa rookhaven", ("party", "c26"), ["new_question"]),
        T("back to ashvenny south, what share of the count is done", ("progress", AS),
          ["follow_up", "return"]),
    ], ["new_question", "follow_up"]),
    conv([
        T("how is the harbour alliance doing in ash venny south", ("pward", "harbour", AS),
          ["voice", "mishearing"]),
        T("and in ash venny north", ("pward", "harbour", AN), ["voice", "follow_up", "ellipsis"]),
        T("is it over there", ("progress", AN), ["voice", "follow_up", "pronoun"]),
    ], ["voice", "follow_up"]),
    conv([
        T("has oskary won", ("cresult", "c09"), ["partial"]),
        T("who's second behind him", ("place", BQ, 2), ["follow_up", "pronoun"]),
        T("which party's she from", ("party", "c10"), ["follow_up", "pronoun"]),
    ], ["partial", "pronoun"]),
    conv([
        T("who's second in wrenlow sands", ("place", WS, 2), ["exact"]),
        T("ah ok, and quellan cross?", ("place", QC, 2), ["follow_up", "ellipsis"]),
        T("thanks anyway", ("thanks",), ["thanks_between"]),
    ], ["follow_up"]),
    conv([
        T("how many seats have they won", CL("party_seats", {}), ["missing_slot", "pronoun"],
          focus="count"),
        T("the lantern party", ("pseats", "lantern"), ["follow_up"]),
        T("and overall who has most seats", ("totals",), ["follow_up"], focus="table"),
    ], ["missing_slot", "clarify"]),
    conv([
        T("help", ("help",), ["exact"]),
        T("ok, who is winning in the heath", ("leader", PH), ["partial"]),
        T("and how many votes do the greens have there", ("pward", "greens", PH),
          ["follow_up", "pronoun"], focus="mark"),
        T("brilliant ta", ("thanks",), ["thanks_between"]),
    ], ["follow_up"]),
]


CASES += [
    T("ashvenny results", CL("ward_results", {}, ASH), ["partial", "ambiguous"], focus="results"),
    T("how is the ashvenny count going", CL("count_progress", {}, ASH), ["partial", "ambiguous"],
      focus="status"),
    T("who is in fourth place in caddenmill", ("place", CM, 4), ["number_words"]),
    T("who came in at number three in dunvarrick", ("place", DV, 3), ["number_words"]),
    T("whos leading in gorsvane", ("leader", GV), ["misspelling", "contraction"]),
    T("resluts for fennick green", ("results", FG), ["misspelling"]),
    T("wich party is oswin pembrev", ("party", "c24"), ["misspelling"]),
    T("is wynn jessavy ahead of elric ivenhall", ("compare", "c22", "c21"), ["exact"],
      focus="whether"),
    T("has vesna whitmarren won marrowby yet", ("cresult", "c31", MB), ["exact"]),
    conv([
        T("has brannick won", CL("candidate_result", {}, BRANNICK), ["partial", "ambiguous"],
          focus="whether"),
        T("the civic greens one", ("cresult", "c07"), ["follow_up"]),
        T("what about the other brannick", ("cresult", "c35"), ["follow_up"]),
        T("who's ahead in her ward then", ("leader", PH), ["follow_up", "pronoun"]),
    ], ["ambiguous", "clarify", "pronoun"]),
    conv([
        T("evening! who's ahead in brindle quay", ("leader", BQ), ["chatty"]),
        T("which party is he with", ("party", "c09"), ["follow_up", "pronoun"]),
        T("how are lantern doing in marrowby", ("pward", "lantern", MB), ["partial", "new_question"]),
        T("and the harbour alliance there", ("pward", "harbour", MB), ["follow_up", "pronoun"]),
        T("how much of marrowby is counted", ("progress", MB), ["follow_up"]),
        T("cheers thats all", ("thanks",), ["contraction"]),
    ], ["chatty", "follow_up"]),
]


# ----------------------------------------------------------------- writer
def short_number(x):
    t = x.replace(",", "").replace("%", "")
    return t.isdigit() and len(t) < 3


def build_turn(t):
    intent, slots, outcome, says, never = facts(t["m"])
    says = says + t["extra_says"]
    never = [n for n in never + t["extra_never"] if n and not short_number(n)]
    for n in never:
        for s_ in says:
            if n.lower() in s_.lower():
                raise SystemExit("never %r inside says %r in %r" % (n, s_, t["ask"]))
    out = {"ask": t["ask"], "intent": intent}
    if intent != "none":
        out["slots"] = slots
    if outcome:
        out["outcome"] = outcome
    out["focus"] = t["focus"] or DEFAULT_FOCUS[t["m"][0]]
    if says:
        out["says"] = says
    if never:
        out["never"] = never
    tags = list(t["tags"])
    if intent == "none" and "uncovered" not in tags:
        tags.append("uncovered")
    if outcome == "clarify" and "clarify" not in tags:
        tags.append("clarify")
    out["tags"] = tags
    return out


def build_case(c):
    if "conversation" in c:
        turns = [build_turn(t) for t in c["conversation"]]
        assert 2 <= len(turns) <= 6, c
        # conversation-level tags: the union of the turns' tags plus its own
        return {"conversation": turns, "tags": c["tags"]}
    return build_turn(c)


def main():
    cases = [build_case(c) for c in CASES]
    turns = []
    convs = 0
    for c in cases:
        if "conversation" in c:
            convs += 1
            turns += c["conversation"]
        else:
            turns.append(c)
    asks = [t["ask"].lower() for t in turns]
    dup = {a for a in asks if asks.count(a) > 1 and len(a) > 8}
    if dup:
        raise SystemExit("duplicate asks: %r" % dup)
    unc = [t for t in turns if t["intent"] == "none"]
    header = (
        "# Blind question set: scenario election, moment 23:45\n"
        "# (replay batches 01-05 applied, clock 2027-05-06T23:45+01:00).\n"
        "# Written by tests/eval/blind/round3/label_election_2345.py from the data\n"
        "# files in dataset-demo/election/; do not edit by hand.\n"
        "# turns: %d, conversations: %d, uncovered: %d (%.1f%%)\n"
        % (len(turns), convs, len(unc), 100.0 * len(unc) / len(turns)))
    body = yaml.safe_dump(cases, sort_keys=False, allow_unicode=True, width=100)
    with open(OUT, "w", encoding="utf-8") as f:
        f.write(header + body)
    tagc = {}
    for t in turns:
        for g in t["tags"]:
            tagc[g] = tagc.get(g, 0) + 1
    for c in cases:
        if "conversation" in c:
            for g in c["tags"]:
                tagc["conv:" + g] = tagc.get("conv:" + g, 0) + 1
    print("turns", len(turns), "conversations", convs, "uncovered", len(unc),
          "%.1f%%" % (100.0 * len(unc) / len(turns)))
    print("outcomes", {o: sum(1 for t in turns if t.get("outcome") == o)
                       for o in ("answered", "clarify", "no_data", "not_covered",
                                 "not_understood", None)})
    print("tags", dict(sorted(tagc.items())))


if __name__ == "__main__":
    main()
