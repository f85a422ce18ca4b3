#!/usr/bin/env python3
"""Blind question set for the election scenario at 23:45.

Moment: replay batches 01-05 applied, clock 2027-05-06T23:45+01:00.
Every question carries its intended meaning as data (a small tuple built by
the helpers below); every expected fact is computed from
dataset-demo/election/ by label_election_2345_lib.py.

Run:  python3 label_election_2345.py   -> writes election-2345.yaml
"""

import os
import sys

import yaml

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from label_election_2345_lib import (  # noqa: E402
    Election, fmt_votes, ordinal, safe_never, usable_never,
)

MOMENT_BATCH = 5
NOW = Election(MOMENT_BATCH)
PREV = Election(MOMENT_BATCH - 1)   # 23:30, for never-facts from the wrong moment
NEXT = Election(MOMENT_BATCH + 1)   # 00:00, likewise
assert NOW.as_of == "2027-05-06T23:45:00+01:00", NOW.as_of
CLOCK = "2027-05-06T23:45+01:00"
OUT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "election-2345.yaml")

# ---------------------------------------------------------------------------
# meanings
# ---------------------------------------------------------------------------


def L(contest, focus="who"):            # ward_leader
    return ("leader", contest, focus)


def R(contest, shares=False):           # ward_results
    return ("results", contest, shares)


def P(contest, place):                  # ward_place
    return ("place", contest, place)


def W(contest, focus="who"):             # ward_winner
    return ("winner", contest, focus)


def C(contest, focus="status"):          # count_progress
    return ("progress", contest, focus)


def PW(group, contest, ask="votes", focus="how_did"):   # party_in_ward
    return ("party_ward", group, contest, ask, focus)


def PS(group, focus="count"):           # party_seats
    return ("party_seats", group, focus)


def ST(count=None, focus="table"):      # seat_totals
    return ("seat_totals", count, focus)


def OR(count=False, focus="open"):      # open_races
    return ("open", count, focus)


def CP(comp, ask="party", focus="group_of"):   # candidate_party
    return ("cand_party", comp, ask, focus)


def CR(comp, contest=None, mode="won", focus="whether"):   # candidate_result
    return ("cand_result", comp, contest, mode, focus)


def CMP(comp, rival, contest=None, focus="compare"):   # candidates_compared
    return ("compare", comp, rival, contest, focus)


def CM(comp, contest=None, mode="now", focus="margin"):   # candidate_margin
    return ("cand_margin", comp, contest, mode, focus)


def G():
    return ("greeting",)


def H():
    return ("help",)


def T():
    return ("thanks",)


def CL(intent, options, slots=None, focus="who"):   # clarify
    return ("clarify", intent, options, slots or {}, focus)


def N(focus="other", never=(), outcome="not_covered"):   # no intent
    return ("none", focus, tuple(never), outcome)


# ---------------------------------------------------------------------------
# labelling
# ---------------------------------------------------------------------------

def wrong_moment(contest, cids=None, margin=True, pct=False):
    """Figures for this ward from 23:30 and 00:00 that a reply at 23:45 must not give."""
    cands = []
    for other in (PREV, NEXT):
        if not other.has_figures(contest):
            continue
        if margin and len(other.standings(contest)) > 1:
            cands.append(fmt_votes(other.lead_margin(contest)))
        ids = cids if cids is not None else [c for c, _, _ in other.standings(contest)]
        for c in ids:
            v = other.votes(c)
            if v is not None:
                cands.append(fmt_votes(v))
        if pct:
            cands.append(other.counted_pct(contest))
    legit = NOW.legit_strings(contest) if NOW.has_figures(contest) else set()
    return safe_never(cands, legit)


def label(m):
    kind = m[0]
    d = {}
    if kind == "leader":
        _, k, focus = m
        d.update(intent="ward_leader", slots={"contest": k}, focus=focus)
        if NOW.has_figures(k):
            d["outcome"] = "answered"
            d["says"] = [NOW.name(NOW.leader(k))]
            if focus == "margin":
                d["says"].append(fmt_votes(NOW.lead_margin(k)))
            d["never"] = wrong_moment(k, cids=[NOW.leader(k)])
        else:
            d["outcome"] = "no_data"
            d["never"] = wrong_moment(k)
    elif kind == "results":
        _, k, shares = m
        d.update(intent="ward_results", slots={"contest": k}, focus="results")
        if NOW.has_figures(k):
            d["outcome"] = "answered"
            says = []
            for c, v, p in NOW.standings(k):
                says += [NOW.name(c), fmt_votes(v)]
                if shares:
                    says.append(NOW.share(c))
            d["says"] = says
            d["never"] = wrong_moment(k, margin=False)
        else:
            d["outcome"] = "no_data"
            d["never"] = wrong_moment(k)
    elif kind == "place":
        _, k, place = m
        d.update(intent="ward_place", slots={"contest": k, "place": str(place)}, focus="who")
        c = NOW.at_place(k, place) if NOW.has_figures(k) else None
        if c:
            d["outcome"] = "answered"
            d["says"] = [NOW.name(c)]
            d["never"] = wrong_moment(k, cids=[c], margin=False)
        else:
            d["outcome"] = "no_data"
            d["never"] = wrong_moment(k)
    elif kind == "winner":
        _, k, focus = m
        d.update(intent="ward_winner", slots={"contest": k}, focus=focus)
        if NOW.status(k) == "final":
            d["outcome"] = "answered"
            d["says"] = [NOW.name(NOW.leader(k))]
        else:
            d["outcome"] = "no_data"   # live or still to come
    elif kind == "progress":
        _, k, focus = m
        d.update(intent="count_progress", slots={"contest": k}, focus=focus, outcome="answered")
        pct = NOW.counted_pct(k)
        if pct:
            d["says"] = [pct]
        cands = [PREV.counted_pct(k), NEXT.counted_pct(k)]
        d["never"] = safe_never([x for x in cands if x and x != pct],
                                NOW.legit_strings(k) if NOW.has_figures(k) else set())
    elif kind == "party_ward":
        _, g, k, ask, focus = m
        d.update(intent="party_in_ward", slots={"group": g, "contest": k}, focus=focus)
        c = NOW.candidate_in(g, k)
        if c is None:
            d["outcome"] = "no_data"   # the party has no candidate in that ward
            if NOW.has_figures(k):
                d["never"] = [fmt_votes(v) for _, v, _ in NOW.standings(k)]
        elif not NOW.has_figures(k):
            d["outcome"] = "no_data"
            d["never"] = wrong_moment(k, cids=[c], margin=False)
        else:
            d["outcome"] = "answered"
            says = [NOW.name(c)]
            if ask in ("votes", "share", "place", "all"):
                says.append(fmt_votes(NOW.votes(c)))
            if ask in ("share", "all"):
                says.append(NOW.share(c))
            if ask in ("place", "all"):
                says.append(ordinal(NOW.place(c)))
            d["says"] = says
            d["never"] = wrong_moment(k, cids=[c], margin=False)
    elif kind == "party_seats":
        _, g, focus = m
        d.update(intent="party_seats", slots={"group": g}, focus=focus, outcome="answered")
        n = NOW.seats()[g]
        if n:
            d["says"] = [str(n)]
    elif kind == "seat_totals":
        _, count, focus = m
        d.update(intent="seat_totals", slots={"count": str(count)} if count else {},
                 focus=focus, outcome="answered")
        if any(NOW.seats().values()):
            d["says"] = [NOW.party(g) for g, n in NOW.seats().items() if n]
    elif kind == "open":
        _, count, focus = m
        d.update(intent="open_races", slots={}, focus=focus, outcome="answered")
        wards = NOW.open_wards()
        d["says"] = [str(len(wards))] if count else [NOW.ward(k) for k in wards]
    elif kind == "cand_party":
        _, c, ask, focus = m
        d.update(intent="candidate_party", slots={"competitor": c}, focus=focus, outcome="answered")
        party, ward = NOW.party(NOW.party_of(c)), NOW.ward(NOW.ward_of(c))
        d["says"] = {"party": [party], "ward": [ward], "both": [party, ward]}[ask]
        d["never"] = [NOW.party(g) for g in NOW.groups if g != NOW.party_of(c)]
    elif kind == "cand_result":
        _, c, k, mode, focus = m
        slots = {"competitor": c}
        if k:
            assert k == NOW.ward_of(c)
            slots["contest"] = k
        d.update(intent="candidate_result", slots=slots, focus=focus)
        ward = NOW.ward_of(c)
        if mode == "won":
            d["outcome"] = "answered" if NOW.status(ward) == "final" else "no_data"
        else:   # how is the candidate doing: their votes so far
            if NOW.has_figures(ward):
                d["outcome"] = "answered"
                d["says"] = [fmt_votes(NOW.votes(c))]
                d["never"] = wrong_moment(ward, cids=[c], margin=False)
            else:
                d["outcome"] = "no_data"
    elif kind == "compare":
        _, c, r, k, focus = m
        slots = {"competitor": c, "rival": r}
        if k:
            slots["contest"] = k
        d.update(intent="candidates_compared", slots=slots, focus=focus)
        ward = NOW.ward_of(c)
        assert ward == NOW.ward_of(r)
        if NOW.has_figures(ward):
            d["outcome"] = "answered"
            ahead = c if NOW.votes(c) > NOW.votes(r) else r
            d["says"] = [NOW.name(ahead)]
        else:
            d["outcome"] = "no_data"
    elif kind == "cand_margin":
        _, c, k, mode, focus = m
        slots = {"competitor": c}
        if k:
            slots["contest"] = k
        d.update(intent="candidate_margin", slots=slots, focus=focus)
        ward = NOW.ward_of(c)
        if mode == "now" and NOW.has_figures(ward):
            gap, other = NOW.gap(c)
            d["outcome"] = "answered"
            d["says"] = [fmt_votes(gap), NOW.name(other)]
            d["never"] = wrong_moment(ward, cids=[], margin=True)
        else:   # a final margin asked while the count goes on
            d["outcome"] = "no_data"
    elif kind in ("greeting", "help", "thanks"):
        d.update(intent=kind, slots={}, focus="chat", outcome="answered")
    elif kind == "clarify":
        _, intent, options, slots, focus = m
        d.update(intent=intent, slots=slots, focus=focus, outcome="clarify", says=list(options))
    elif kind == "none":
        _, focus, never, outcome = m
        d.update(intent="none", focus=focus, outcome=outcome)
        if never:
            d["never"] = list(never)
    else:
        raise ValueError(m)
    if "never" in d:
        d["never"] = [x for x in d["never"] if usable_never(x)]
    for k in ("says", "never"):
        if k in d and not d[k]:
            del d[k]
    return d


# ---------------------------------------------------------------------------
# facts used inside some uncovered questions' never lists
# ---------------------------------------------------------------------------
AN_MARGIN_NOW = fmt_votes(NOW.lead_margin("ashvenny-north"))
LIVE_WARDS = [NOW.ward(k) for k in NOW.contests if NOW.status(k) == "live"]
SCHEDULED_WARDS = [NOW.ward(k) for k in NOW.contests if NOW.status(k) == "scheduled"]
HAL_AN_VOTES = fmt_votes(NOW.votes("c01"))
HAL_AS_VOTES = fmt_votes(NOW.votes("c05"))


def WARDS_CALLED(word):
    """Wards whose name or alias is exactly this word (what a reader typed)."""
    out = []
    for sp in NOW.sports:
        for dsc in sp["disciplines"]:
            if word.lower() in [a.lower() for a in [dsc["name"]] + dsc["aliases"]]:
                out.append(dsc["name"])
    assert len(out) > 1, (word, out)
    return out


def CANDIDATES_CALLED(word):
    """Candidates whose given or family name is this word."""
    out = [NOW.name(c) for c, x in NOW.comps.items()
           if word.lower() in (x["given"].lower(), x["family"].lower())]
    assert len(out) > 1, (word, out)
    return out

# ---------------------------------------------------------------------------
# the questions: each case is a list of turns (ask, meaning, tags)
# ---------------------------------------------------------------------------
CASES = [
    # 1 voice reader, Ashvenny North, mishearing
    [("hey tidings", G(), ["voice"]),
     ("whos ahead in ash venny north right now", L("ashvenny-north"), ["voice", "mishearing"]),
     ("by how many votes", L("ashvenny-north", "margin"), ["voice", "follow_up", "ellipsis"]),
     ("and how much of it is counted", C("ashvenny-north"), ["voice", "follow_up", "ellipsis"]),
     ("cheers", T(), ["voice"])],

    # 2 Caddenmill close race
    [("what's happening in caddenmill?", R("caddenmill"), ["chatty"]),
     ("is corrigane still ahead of fennow", CMP("c12", "c13", "caddenmill", focus="whether"),
      ["partial", "follow_up"]),
     ("how big is the gap between them", L("caddenmill", "margin"), ["follow_up", "pronoun"]),
     ("what about the green candidate there", PW("greens", "caddenmill", "votes"),
      ["follow_up", "ellipsis"]),
     ("was turnout up there compared to 2023?", N("other"), ["uncovered", "follow_up"])],

    # 3 Ashvenny is two wards
    [("who's leading in ashvenny", CL("ward_leader", WARDS_CALLED("Ashvenny")),
      ["ambiguous", "partial"]),
     ("south", L("ashvenny-south"), ["follow_up", "ellipsis"]),
     ("and the north one?", L("ashvenny-north"), ["follow_up", "ellipsis"]),
     ("what share has the alliance got in the south", PW("harbour", "ashvenny-south", "share", "mark"),
      ["follow_up", "partial"])],

    # 4 Brannick is two candidates
    [("which party is brannick with", CL("candidate_party", CANDIDATES_CALLED("Brannick"),
                                          focus="group_of"), ["ambiguous", "partial"]),
     ("the one standing in pellin heath", CP("c35", "both"), ["follow_up"]),
     ("is she ahead of lowen abernell", CMP("c35", "c34", "pellin-heath", focus="whether"), ["follow_up", "pronoun"]),
     ("who's top in the heath then", L("pellin-heath"), ["follow_up", "partial"]),
     ("ta", T(), [])],

    # 5 seats so far
    [("how many seats has harbour alliance got so far", PS("harbour"), []),
     ("and the progressives?", PS("moorland"), ["follow_up", "ellipsis", "partial"]),
     ("overall seat count please", ST(), ["follow_up"]),
     ("how many wards are still to declare", OR(True, "count"), ["follow_up"])],

    # 6 voice, Brindle Quay
    [("who is winning in brindle key", L("brindle-quay"), ["voice", "mishearing"]),
     ("and who is third there", P("brindle-quay", 3), ["voice", "follow_up"]),
     ("and she is with which party", CP("c11"), ["voice", "follow_up", "pronoun"]),
     ("where is the brindle quay count being held", N("where"), ["voice", "uncovered", "new_question"]),
     ("ok how far has the count got", C("brindle-quay"), ["voice", "follow_up"])],

    # 7 Lanmouth, turnout and declaration time
    [("what was turnout in lanmouth last time round", N("other"), ["uncovered"]),
     ("ok then who is leading lanmouth", L("lanmouth"), ["follow_up"]),
     ("how much has been counted", C("lanmouth"), ["follow_up", "ellipsis"]),
     ("when will they declare", N("when"), ["uncovered", "follow_up", "pronoun"])],

    # 8 open races
    [("which wards are still counting?", OR(), []),
     ("which of those haven't even started yet", N("open", never=LIVE_WARDS[:3]),
      ["uncovered", "constraint", "follow_up"]),
     ("when does wrenlow sands get going", N("when"), ["uncovered", "follow_up"]),
     ("what about quellan cross, how much counted there", C("quellan-cross"), ["follow_up"])],

    # 9 candidate parties
    [("what party does orla quenlow represent", CP("c01"), ["exact"]),
     ("and pim wystrel", CP("c20"), ["follow_up", "ellipsis"]),
     ("where's he standing", CP("c20", "ward", "where"), ["follow_up", "pronoun", "contraction"]),
     ("is he beating juna tullock", CMP("c20", "c19", focus="whether"), ["follow_up", "pronoun"]),
     ("thanks. who's second in gorsevane", P("gorsevane", 2), ["thanks_between", "new_question"])],

    # 10 Gorsevane
    [("gorsevane latest?", R("gorsevane"), ["terse"]),
     ("thats tight - how many votes between first and second", L("gorsevane", "margin"),
      ["follow_up", "chatty"]),
     ("what % counted", C("gorsevane"), ["follow_up", "ellipsis", "terse"]),
     ("is the tollgate guy ahead of quaddle", CMP("c24", "c25", "gorsevane", focus="whether"),
      ["follow_up", "partial"]),
     ("has orrick won it yet", CR("c23", "gorsevane"), ["follow_up", "partial"])],

    # 11 Marrowby, early count
    [("any numbers out of marrowby", R("marrowby"), ["chatty"]),
     ("whos leading", L("marrowby"), ["follow_up", "ellipsis"]),
     ("only six percent counted, is that right?", C("marrowby"), ["follow_up", "number_words"]),
     ("and what did the lanterns get there", PW("lantern", "marrowby", "votes"), ["follow_up"]),
     ("as a percentage?", PW("lantern", "marrowby", "share", "mark"), ["follow_up", "ellipsis"])],

    # 12 Dunvarrick
    [("whos ahead in dunvarrick", L("dunvarrick"), []),
     ("which party is lusketh", CP("c16"), ["follow_up", "partial"]),
     ("how many seats have tollgate won tonight", PS("tollgate"), ["relative_day", "partial"]),
     ("is the dunvarrick count at the drill hall?", N("where"), ["uncovered"]),
     ("ok, harbour's candidate in dunvarrick, how many votes", PW("harbour", "dunvarrick", "votes"),
      ["new_question"])],

    # 13 Fennick Green by voice
    [("who's top in phoenix green", L("fennick-green"), ["voice", "mishearing"]),
     ("are the greens winning there", PW("greens", "fennick-green", "name", "whether"),
      ["voice", "follow_up"]),
     ("whats their share", PW("greens", "fennick-green", "share", "mark"), ["voice", "follow_up", "pronoun"]),
     ("and the progressives there", PW("moorland", "fennick-green", "votes"), ["voice", "follow_up", "ellipsis"]),
     ("what place is that", PW("moorland", "fennick-green", "place", "how_did"), ["voice", "follow_up"])],

    # 14 singles
    [("Caddenmill full result pls", R("caddenmill"), ["terse"])],
    [("who came fourth in ashvenny south", P("ashvenny-south", 4), ["number_words"])],
    [("wrenlow sands results", R("wrenlow-sands"), ["terse"])],
    [("who won quellan cross", W("quellan-cross"), [])],
    [("has anyone actually won a seat yet", ST(focus="whether"), ["chatty"])],

    # 19 help
    [("what can you tell me", H(), []),
     ("ok what's the seat tally", ST(), ["follow_up"]),
     ("top 3 parties?", ST(3), ["follow_up", "ellipsis"]),
     ("who leads the harbour alliance as a party", N("other"), ["uncovered"]),
     ("fair enough. how many seats have the civic greens got", PS("greens"), ["new_question"])],

    # 20 across wards (uncovered) then back to one ward
    [("which ward is the closest race right now", N("margin"), ["uncovered", "across_wards"]),
     ("where are the greens doing best", N("who"), ["uncovered", "across_wards"]),
     ("total votes for the lantern party across the county?", N("mark"), ["uncovered", "across_wards"]),
     ("fine, then who leads in the quay", L("brindle-quay"), ["partial"]),
     ("by what margin", L("brindle-quay", "margin"), ["follow_up", "ellipsis"])],

    # 21 time restriction
    [("what was the lead in ashvenny north at eleven o'clock", N("margin", never=[AN_MARGIN_NOW]),
      ["uncovered", "constraint", "number_words"]),
     ("and now?", L("ashvenny-north", "margin"), ["follow_up", "ellipsis"]),
     ("how far behind is vardisse", CM("c02", "ashvenny-north"), ["follow_up", "partial"]),
     ("what's her party", CP("c02"), ["follow_up", "pronoun", "contraction"])],

    # 23 compare in Caddenmill
    [("is ulric fennow ahead of nevin corrigane", CMP("c13", "c12", focus="whether"), ["exact"]),
     ("how far behind is fennow", CM("c13"), ["follow_up", "partial"]),
     ("whats the count at in caddenmill", C("caddenmill"), ["follow_up"]),
     ("who's in 3rd", P("caddenmill", 3), ["follow_up", "ellipsis"]),
     ("and last", P("caddenmill", 4), ["follow_up", "ellipsis"])],

    # 24 voice mishearing a candidate
    [("what party is oral quen low", CP("c01"), ["voice", "mishearing"]),
     ("is she leading", L("ashvenny-north", "whether"), ["voice", "follow_up", "pronoun"]),
     ("how many votes does she have", CR("c01", mode="how", focus="how_did"), ["voice", "follow_up", "pronoun"]),
     ("is she the sitting councillor", N("other"), ["voice", "uncovered", "follow_up"])],

    # 25 Harbour across named wards
    [("how did the harbour alliance do in lanmouth", PW("harbour", "lanmouth", "votes"), []),
     ("and in marrowby?", PW("harbour", "marrowby", "votes"), ["follow_up", "ellipsis"]),
     ("and pellin?", PW("harbour", "pellin-heath", "votes"), ["follow_up", "ellipsis", "partial"]),
     ("how many seats have they got altogether", PS("harbour"), ["follow_up", "pronoun"]),
     ("thx", T(), [])],

    # 26 chatty voice, Gorsevane
    [("okay so um who is uh leading the count in gorse vane", L("gorsevane"), ["voice", "mishearing", "chatty"]),
     ("and whats the margin", L("gorsevane", "margin"), ["voice", "follow_up", "ellipsis"]),
     ("is that with most of the votes counted", C("gorsevane"), ["voice", "follow_up"]),
     ("how much is orrick ahead by", CM("c23", "gorsevane"), ["voice", "follow_up", "partial"])],

    # 27 typos
    [("whos wining in lanmuoth", L("lanmouth"), ["misspelling"]),
     ("votes for each candidate?", R("lanmouth"), ["follow_up"]),
     ("percentages too please", R("lanmouth", shares=True), ["follow_up", "ellipsis"]),
     ("who is maren umbersley with", CP("c29"), ["follow_up"])],

    # 28 places
    [("who's running second in the sands", P("wrenlow-sands", 2), ["partial"]),
     ("ok what about second in the heath", P("pellin-heath", 2), ["follow_up", "partial"]),
     ("and last?", P("pellin-heath", 3), ["follow_up", "ellipsis"]),
     ("whose side is she on, party-wise", CP("c35"), ["follow_up", "pronoun", "chatty"])],

    # 29 Quellan Cross, not started
    [("is kesia carravine a sitting councillor", N("other"), ["uncovered"]),
     ("what party is she", CP("c36"), ["follow_up", "pronoun"]),
     ("has counting started in her ward", C("quellan-cross"), ["follow_up", "pronoun"]),
     ("when's it due to start", N("when"), ["uncovered", "follow_up", "contraction"])],

    # 30 open races variants
    [("what races are still undecided", OR(), []),
     ("how many is that", OR(True, "count"), ["follow_up", "pronoun"]),
     ("has ashvenny north been called yet", W("ashvenny-north", "status"), ["new_question"]),
     ("which count centre is it at", N("where"), ["uncovered", "follow_up", "pronoun"])],

    # 31 not understood / off-beat
    [("asdfgh", N("other", outcome="not_understood"), ["gibberish"])],
    [("can you book me a taxi to the civic hall", N("other", outcome="not_understood"), []),
     ("sorry wrong app. who leads in quellan cross", L("quellan-cross"), ["new_question"]),
     ("and wrenlow?", L("wrenlow-sands"), ["follow_up", "ellipsis", "partial"])],

    # 33 candidate_result
    [("did sabeth pellagan win ashvenny south", CR("c05", "ashvenny-south"), ["exact"]),
     ("how many votes has she got so far", CR("c05", "ashvenny-south", mode="how", focus="how_did"), ["follow_up", "pronoun"]),
     ("and torvane?", CR("c06", "ashvenny-south", mode="how", focus="how_did"), ["follow_up", "ellipsis", "partial"]),
     ("is he closing the gap", N("margin"), ["uncovered", "follow_up", "pronoun"])],

    # 34 top two on seats
    [("give me the top two parties on seats", ST(2), ["number_words"]),
     ("does anyone have a majority", N("other"), ["uncovered", "follow_up"])],

    # 35 thanks in the middle and return
    [("who leads in ashvenny south", L("ashvenny-south"), []),
     ("thank you!", T(), ["thanks_between"]),
     ("which party is gaspard torvane", CP("c06"), ["new_question"]),
     ("back to ashvenny south - how much is counted", C("ashvenny-south"), ["follow_up"]),
     ("and who's 3rd", P("ashvenny-south", 3), ["follow_up", "ellipsis"]),
     ("what party is she in", CP("c07"), ["follow_up", "pronoun"])],

    # 36 number words places
    [("whos number three in fennick", P("fennick-green", 3), ["number_words", "partial"]),
     ("and number four", P("fennick-green", 4), ["number_words", "follow_up", "ellipsis"]),
     ("full fennick green standings", R("fennick-green"), ["follow_up"])],

    # 37 relative day and declaration
    [("who won caddenmill tonight", W("caddenmill"), ["relative_day"]),
     ("will it be declared before tomorrow morning", N("when"), ["uncovered", "relative_day", "follow_up"]),
     ("who's ahead for now then", L("caddenmill"), ["follow_up", "chatty"])],

    # 38 previous election (data does not hold it)
    [("who held brindle quay before this election", N("who"), ["uncovered"]),
     ("did the lantern party win it in 2023", N("whether"), ["uncovered", "follow_up"]),
     ("ok who is leading it now", L("brindle-quay"), ["follow_up", "pronoun"]),
     ("is he lantern party", CP("c09", focus="whether"), ["follow_up", "pronoun"]),
     ("how many votes has he got", CR("c09", "brindle-quay", mode="how", focus="how_did"), ["follow_up", "pronoun"])],

    # 39 Wrenlow Sands
    [("any results from wrenlow sands yet", R("wrenlow-sands"), []),
     ("which party is yara glenvane", CP("c40"), ["new_question"]),
     ("and joram hestermoor?", CP("c41"), ["follow_up", "ellipsis"]),
     ("is he ahead of her", CMP("c41", "c40", "wrenlow-sands", focus="whether"), ["follow_up", "pronoun"])],

    # 40 across-ward margins (uncovered)
    [("whats the biggest lead in any ward", N("margin"), ["uncovered", "across_wards"]),
     ("which party is ahead in the most wards", N("who"), ["uncovered", "across_wards"]),
     ("how many wards is moorland leading in", N("count"), ["uncovered", "across_wards"])],

    # 41 county-wide votes (uncovered), then a ward
    [("how many votes have been counted in the whole county so far", N("count"), ["uncovered", "across_wards"]),
     ("whats the electorate in dunvarrick", N("other"), ["uncovered"]),
     ("how far through is the dunvarrick count", C("dunvarrick"), ["follow_up"])],

    # 42 Lanmouth town alias
    [("lanmouth town, who's second", P("lanmouth", 2), ["partial"]),
     ("shes which party?", CP("c27"), ["follow_up", "pronoun", "misspelling"]),
     ("how far behind rookhaven is she", CM("c27", "lanmouth"), ["follow_up", "pronoun", "partial"]),
     ("is the lanmouth count at the leisure centre", N("where"), ["uncovered"])],

    # 43 party without a candidate
    [("how are the lanterns doing in dunvarrick", PW("lantern", "dunvarrick", "votes"), ["partial"]),
     ("who is standing for tollgate in ashvenny north", PW("tollgate", "ashvenny-north", "name", "who"), []),
     ("and who is the greens candidate there", PW("greens", "ashvenny-north", "name", "who"), ["follow_up"])],

    # 44 Greens seats
    [("have the civic greens won anything yet", PS("greens", "whether"), []),
     ("which wards are they standing in", N("where"), ["uncovered", "follow_up", "pronoun"]),
     ("how are they doing in wrenlow", PW("greens", "wrenlow-sands", "votes"), ["follow_up", "pronoun"])],

    # 45 terse abbreviations
    [("ash north lead", L("ashvenny-north", "margin"), ["terse", "partial"])],
    [("ash sth % counted", C("ashvenny-south"), ["terse", "partial"])],

    # 47 who beat / did lose
    [("who beat varian kestrove", CM("c04", mode="final", focus="who"), []),
     ("where's he standing again", CP("c04", "ward", "where"), ["follow_up", "pronoun"]),
     ("and his votes so far", CR("c04", mode="how", focus="how_did"), ["follow_up", "ellipsis"])],

    # 48 schedule questions (uncovered)
    [("what counts are on at tamsendale civic hall", N("schedule"), ["uncovered"]),
     ("when did the caddenmill count start", N("when"), ["uncovered"]),
     ("which wards start at quarter to midnight", N("schedule"), ["uncovered", "number_words"]),
     ("ok. caddenmill, who's leading", L("caddenmill"), ["new_question"]),
     ("by how much", L("caddenmill", "margin"), ["follow_up", "ellipsis"])],

    # 49 ward_place voice
    [("who is in second place in brindle quay", P("brindle-quay", 2), ["voice"]),
     ("and what party is nessa mirror when", CP("c10"), ["voice", "mishearing", "follow_up"]),
     ("how far behind oscary is she", CM("c10", "brindle-quay"), ["voice", "mishearing", "follow_up"])],

    # 50 Pellin Heath
    [("pellin heath who is ahead", L("pellin-heath"), []),
     ("and by how many", L("pellin-heath", "margin"), ["follow_up", "ellipsis"]),
     ("percentage counted?", C("pellin-heath"), ["follow_up", "ellipsis"]),
     ("what has the moorland candidate got there", PW("moorland", "pellin-heath", "votes"), ["follow_up"]),
     ("how many postal votes are still to be counted there", N("count"), ["follow_up", "uncovered"]),
     ("thanks that's all", T(), [])],

    # 51 compare in Ashvenny North, then share
    [("is odile yellmer beating varian kestrove", CMP("c03", "c04", focus="whether"), ["exact"]),
     ("what's the lantern party's share in ashvenny north", PW("lantern", "ashvenny-north", "share", "mark"),
      ["follow_up"]),
     ("and the greens'", PW("greens", "ashvenny-north", "share", "mark"), ["follow_up", "ellipsis"]),
     ("who's top there", L("ashvenny-north"), ["follow_up"])],

    # 52 candidate party and where, voice mishearings
    [("which ward is elric ivan hall standing in", CP("c21", "ward", "where"), ["voice", "mishearing"]),
     ("and what party", CP("c21"), ["voice", "follow_up", "ellipsis"]),
     ("is he ahead of wynn jessavy", CMP("c21", "c22", focus="whether"), ["voice", "follow_up", "pronoun"]),
     ("how old is he", N("other"), ["voice", "uncovered", "follow_up", "pronoun"])],

    # 53 Dunvarrick mishearing and Fenwick
    [("who's leading in done varick", L("dunvarrick"), ["voice", "mishearing"]),
     ("what about fenwick savrelle how many votes", CR("c18", "dunvarrick", mode="how", focus="how_did"), ["voice", "follow_up"]),
     ("what party is he", CP("c18"), ["voice", "follow_up", "pronoun"]),
     ("has he won", CR("c18", "dunvarrick"), ["voice", "follow_up", "pronoun"])],

    # 54 greeting, help, then work
    [("hello", G(), []),
     ("what kind of things can i ask", H(), ["follow_up"]),
     ("ok which races are still open", OR(), ["follow_up"]),
     ("and which ones are too close to call", N("open"), ["uncovered", "follow_up", "constraint"]),
     ("what's the leader's margin in gorsevane", L("gorsevane", "margin"), ["new_question"])],

    # 55 party in ward, place
    [("where did the moorland progressives come in caddenmill", PW("moorland", "caddenmill", "place", "how_did"), ["exact"]),
     ("and the harbour alliance", PW("harbour", "caddenmill", "place", "how_did"), ["follow_up", "ellipsis"]),
     ("what's the difference between them", L("caddenmill", "margin"), ["follow_up", "pronoun"]),
     ("what was it an hour ago", N("margin"), ["uncovered", "follow_up", "constraint"])],

    # 56 Lanmouth greens voice
    [("hows the civic greens getting on in lan mouth", PW("greens", "lanmouth", "votes"), ["voice", "mishearing"]),
     ("whats their percentage", PW("greens", "lanmouth", "share", "mark"), ["voice", "follow_up", "pronoun"]),
     ("who's winning there", L("lanmouth"), ["voice", "follow_up"]),
     ("what party is that", CP("c26"), ["voice", "follow_up", "pronoun"])],

    # 57 Marrowby vs Yarrowby confusion
    [("is talia yarrowby ahead of vesna whitmarren", CMP("c32", "c31", focus="whether"), ["exact"]),
     ("by how much is whitmarren behind the leader", CM("c31"), ["follow_up", "partial"]),
     ("who is the leader", L("marrowby"), ["follow_up"]),
     ("his party?", CP("c30"), ["follow_up", "ellipsis", "pronoun"])],

    # 58 Quellan Cross, voice mishearing
    [("quillan cross results please", R("quellan-cross"), ["voice", "mishearing"]),
     ("hows much counted", C("quellan-cross"), ["follow_up", "misspelling"]),
     ("how many people voted there last time", N("count"), ["uncovered", "follow_up"]),
     ("what party is perrin farrowgate", CP("c39"), ["follow_up"])],

    # 59 combined ashvenny harbour votes (uncovered)
    [("how many votes has the alliance got across both ashvenny wards",
      N("mark", never=[HAL_AN_VOTES, HAL_AS_VOTES]), ["uncovered", "across_wards", "constraint"]),
     ("just ashvenny south then", PW("harbour", "ashvenny-south", "votes"), ["follow_up"])],

    # 60 seats restricted by venue (uncovered)
    [("how many seats have been declared at the drill hall", N("count"), ["uncovered", "constraint"]),
     ("and which wards are counted there", N("where"), ["uncovered", "follow_up"]),
     ("ok just tell me the seat totals", ST(), ["follow_up"])],

    # 61 Oswin Pembrev
    [("oswin pembrev what party", CP("c24"), ["terse"]),
     ("how far is he behind", CM("c24"), ["follow_up", "pronoun"]),
     ("who's in front of him", L("gorsevane"), ["follow_up", "pronoun"])],

    # 62 candidate lookups, typos
    [("which party does hesper ambrel belong to", CP("c15"), ["misspelling"]),
     ("is she ahead of corin gadrel", CMP("c15", "c14", focus="whether"), ["follow_up", "pronoun"]),
     ("who's leading their ward", L("caddenmill"), ["follow_up", "pronoun"])],

    # 63 Brindle Quay full with shares, voice
    [("give me the brindle quay numbers with percentages", R("brindle-quay", shares=True), ["constraint"]),
     ("is ivo oskary going to win", N("whether"), ["uncovered", "follow_up"]),
     ("has he won yet", CR("c09", "brindle-quay"), ["follow_up", "pronoun"])],

    # 64 Tollgate
    [("tollgate independents how many seats", PS("tollgate"), ["terse"]),
     ("their share in gorsevane?", PW("tollgate", "gorsevane", "share", "mark"), ["follow_up", "pronoun"]),
     ("and in ashvenny south", PW("tollgate", "ashvenny-south", "share", "mark"), ["follow_up", "ellipsis"]),
     ("what's their vote share county-wide", N("mark"), ["uncovered", "across_wards", "follow_up"])],

    # 65 seat_totals chatty
    [("so where do we stand on seats, roughly", ST(), ["chatty"]),
     ("what about the lanterns specifically", PS("lantern"), ["follow_up"]),
     ("and how many seats are there in total on the council", N("count"), ["uncovered", "follow_up"])],

    # 66 Fennick Green winner and progress
    [("has fennick green declared", W("fennick-green", "status"), ["partial"]),
     ("how much is counted then", C("fennick-green"), ["follow_up"]),
     ("who's leading and by how much", L("fennick-green", "margin"), ["follow_up"]),
     ("how far behind is wystrel", CM("c20", "fennick-green"), ["follow_up", "partial"])],

    # 67 Mirela Stellick mishearing
    [("what party is mirella stellic", CP("c27", "both", "group_of"), ["voice", "mishearing"]),
     ("did she win", CR("c27"), ["voice", "follow_up", "pronoun"]),
     ("who's ahead of her", L("lanmouth"), ["voice", "follow_up", "pronoun"])],

    # 69 missing ward: the service must ask back
    [("who's in second place?", CL("ward_place", [], {"place": "2"}), ["missing_slot"]),
     ("caddenmill", P("caddenmill", 2), ["follow_up", "ellipsis"]),
     ("how much is counted", C("caddenmill"), ["follow_up", "ellipsis"]),
     ("and in dunvarick", C("dunvarrick"), ["follow_up", "ellipsis", "misspelling"])],
    [("what percent of the ward is counted so far?", CL("count_progress", [], focus="status"), ["missing_slot"]),
     ("in the sands", C("wrenlow-sands"), ["follow_up", "ellipsis", "partial"]),
     ("what about marowby", C("marrowby"), ["follow_up", "ellipsis", "misspelling"])],

    # 71 typos throughout
    [("whos leadin in quelan cross", L("quellan-cross"), ["misspelling"]),
     ("wat about pelin heath", L("pellin-heath"), ["follow_up", "ellipsis", "misspelling"]),
     ("resluts for brindle quay", R("brindle-quay"), ["misspelling", "new_question"]),
     ("is nesa mirrowen ahed of brisa halvesk", CMP("c10", "c11", "brindle-quay", focus="whether"),
      ["misspelling", "follow_up"])],

    # 68 Sten / Ameline compare
    [("is ameline rennow ahead of fenwick savrelle in dunvarrick", CMP("c17", "c18", "dunvarrick", "whether"),
      ["exact"]),
     ("how many votes behind lusketh is rennow", CM("c17", "dunvarrick"), ["follow_up", "partial"]),
     ("how much of dunvarrick is counted", C("dunvarrick"), ["follow_up"])],
]

# ---------------------------------------------------------------------------
# build YAML
# ---------------------------------------------------------------------------


def build():
    out = []
    n_turns = n_unc = 0
    for case in CASES:
        turns = []
        for ask, m, tags in case:
            t = {"ask": ask}
            lab = label(m)
            t["intent"] = lab["intent"]
            if lab["intent"] != "none":
                t["slots"] = lab["slots"]
            t["outcome"] = lab["outcome"]
            t["focus"] = lab["focus"]
            if "says" in lab:
                t["says"] = lab["says"]
            if "never" in lab:
                t["never"] = lab["never"]
            tags = list(tags)
            if lab["outcome"] in ("not_covered", "not_understood") and "uncovered" not in tags:
                tags.append("uncovered")
            if lab["outcome"] == "clarify" and "clarify" not in tags:
                tags.append("clarify")
            if tags:
                t["tags"] = tags
            turns.append(t)
            n_turns += 1
            if "uncovered" in tags:
                n_unc += 1
        if len(turns) == 1:
            out.append(turns[0])
        else:
            out.append({"conversation": turns, "tags": ["conversation"]})
    return out, n_turns, n_unc


def main():
    cases, n_turns, n_unc = build()
    header = (
        "# Blind question set: scenario election, moment 23:45\n"
        "# (replay batches 01-05 applied; clock %s; data as of %s).\n"
        "# Written by tests/eval/blind/round6/label_election_2345.py"
        " (with label_election_2345_lib.py); every fact computed from dataset-demo/election/.\n"
        "# %d cases, %d turns, %d uncovered (%.1f%%).\n"
        % (CLOCK, NOW.as_of, len(cases), n_turns, n_unc, 100.0 * n_unc / n_turns)
    )
    body = yaml.safe_dump(cases, sort_keys=False, allow_unicode=True, width=100)
    with open(OUT, "w", encoding="utf-8") as f:
        f.write(header + body)
    # self-check
    with open(OUT, encoding="utf-8") as f:
        back = yaml.safe_load(f)
    assert back == cases
    print("wrote %s: %d cases, %d turns, %d uncovered (%.1f%%)"
          % (OUT, len(cases), n_turns, n_unc, 100.0 * n_unc / n_turns))


if __name__ == "__main__":
    main()
