#!/usr/bin/env python3
"""Blind question set for the election scenario at 03:45 (2027-05-07T03:45+01:00).

Reads dataset-demo/election/*.json, applies every replay batch up to the
moment (a `results` change replaces the contest's status, entries, counted
and updated), computes every expected fact from that state, and writes
election-0345.yaml beside this script.

Standard library + PyYAML only.
"""
import copy
import glob
import json
import os
from datetime import datetime
from decimal import Decimal, ROUND_HALF_UP

import yaml

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.abspath(os.path.join(HERE, "..", "..", "..", ".."))
DATA = os.path.join(ROOT, "dataset-demo", "election")
OUT = os.path.join(HERE, "election-0345.yaml")

MOMENT = datetime.fromisoformat("2027-05-07T03:45:00+01:00")
EARLIER = datetime.fromisoformat("2027-05-07T03:30:00+01:00")  # for stale-figure `never`s


def load(name):
    with open(os.path.join(DATA, name), encoding="utf-8") as f:
        return json.load(f)


COMPETITORS = {c["id"]: c for c in load("competitors.json")}
GROUPS = {g["id"]: g for g in load("groups.json")}
BASE_CONTESTS = {c["id"]: c for c in load("contests.json")}
WARD_NAMES = {d["id"]: d["name"] for s in load("sports.json") for d in s["disciplines"]}


def state_at(moment):
    contests = copy.deepcopy(BASE_CONTESTS)
    for path in sorted(glob.glob(os.path.join(DATA, "replay", "*.json"))):
        with open(path, encoding="utf-8") as f:
            batch = json.load(f)
        if datetime.fromisoformat(batch["as_of"]) > moment:
            continue
        for ch in batch["changes"]:
            if ch["change"] != "results":
                continue
            c = contests[ch["contest"]]
            for k in ("status", "entries", "counted", "updated"):
                if k in ch:
                    c[k] = ch[k]
    return contests


NOW = state_at(MOMENT)
BEFORE = state_at(EARLIER)

# ---------------------------------------------------------------- helpers


def name(cid):
    p = COMPETITORS[cid]
    return f"{p['given']} {p['family']}"


def gname(gid):
    return GROUPS[gid]["name"]


def ward(contest):
    return WARD_NAMES[NOW[contest]["discipline"]]


def votes(e):
    return int(str(e.get("mark", "0")).replace(",", ""))


def fmt_votes(n):
    return f"{n:,}"


def ranked(contest, state=NOW):
    es = [e for e in state[contest]["entries"] if "place" in e]
    return sorted(es, key=lambda e: e["place"])


def total(contest, state=NOW):
    return sum(votes(e) for e in state[contest]["entries"])


def share(contest, e, state=NOW):
    v = Decimal(votes(e)) * 100 / Decimal(total(contest, state))
    return f"{v.quantize(Decimal('0.1'), rounding=ROUND_HALF_UP)}%"


def ordinal(n):
    suf = "th" if 10 <= n % 100 <= 20 else {1: "st", 2: "nd", 3: "rd"}.get(n % 10, "th")
    return f"{n}{suf}"


WORDS = {1: "one", 2: "two", 3: "three", 4: "four", 5: "five", 6: "six", 7: "seven", 8: "eight", 9: "nine"}


def count_word(n):
    return WORDS.get(n, str(n)) if n else "0"


def counted_pct(contest, state=NOW):
    c = Decimal(str(state[contest].get("counted", 0)))
    return f"{int(c * 100)}%"  # whole percent rounded down


def winner_entry(contest, state=NOW):
    c = state[contest]
    if c["status"] != "final":
        return None
    for e in c["entries"]:
        if e.get("award") == "seat":
            return e
    return ranked(contest, state)[0]


def margin(contest, state=NOW):
    r = ranked(contest, state)
    return votes(r[0]) - votes(r[1])


def entry_of(cid):
    for k, c in NOW.items():
        for e in c["entries"]:
            if e["competitor"] == cid:
                return k, e
    raise KeyError(cid)


def party_entry(group, contest):
    for e in NOW[contest]["entries"]:
        if COMPETITORS[e["competitor"]]["group"] == group:
            return e
    return None


def seats(group):
    n = 0
    for k in NOW:
        w = winner_entry(k)
        if w and COMPETITORS[w["competitor"]]["group"] == group:
            n += 1
    return n


def seat_table():
    rows = [(g, seats(g)) for g in GROUPS]
    return sorted(rows, key=lambda r: -r[1])


def open_contests():
    return [k for k, c in NOW.items() if c["status"] != "final"]


# ---------------------------------------------------------------- intents as data
# Each returns the label for one turn (everything but ask/tags).


def ward_winner(contest, never_from=(), focus="who"):
    w = winner_entry(contest)
    if w is None:
        return dict(intent="ward_winner", slots={"contest": contest}, outcome="no_data", focus=focus)
    never = [name(winner_entry(o)["competitor"]) for o in never_from if winner_entry(o)]
    return dict(intent="ward_winner", slots={"contest": contest}, outcome="answered", focus=focus,
                says=[name(w["competitor"])], never=never)


def ward_leader(contest, focus="who", stale=False):
    c = NOW[contest]
    if c["status"] == "scheduled":
        return dict(intent="ward_leader", slots={"contest": contest}, outcome="no_data", focus=focus)
    r = ranked(contest)
    says = [name(r[0]["competitor"]), fmt_votes(margin(contest))]
    never = []
    if stale:  # figures from the 03:30 batch that are no longer true
        for e in BEFORE[contest]["entries"]:
            m = e["mark"]
            if m not in [x["mark"] for x in c["entries"]]:
                never.append(m)
    return dict(intent="ward_leader", slots={"contest": contest}, outcome="answered", focus=focus,
                says=says, never=never)


def ward_results(contest, shares=False):
    r = ranked(contest)
    says = []
    for e in r:
        says += [name(e["competitor"]), e["mark"]]
        if shares:
            says.append(share(contest, e))
    return dict(intent="ward_results", slots={"contest": contest}, outcome="answered", focus="results",
                says=says)


def party_in_ward(group, contest, focus="how_did", what=("name", "place", "votes")):
    e = party_entry(group, contest)
    if e is None:  # the party put up no candidate in that ward
        return dict(intent="party_in_ward", slots={"group": group, "contest": contest}, outcome="no_data",
                    focus=focus)
    says = []
    if "name" in what:
        says.append(name(e["competitor"]))
    if "place" in what:
        says.append(ordinal(e["place"]))
    if "votes" in what:
        says.append(e["mark"])
    if "share" in what:
        says.append(share(contest, e))
    return dict(intent="party_in_ward", slots={"group": group, "contest": contest}, outcome="answered",
                focus=focus, says=says)


def party_seats(group, focus="count"):
    return dict(intent="party_seats", slots={"group": group}, outcome="answered", focus=focus,
                says=[count_word(seats(group))])


def seat_totals(count=None, focus="table"):
    table = seat_table()
    slots = {} if count is None else {"count": str(count)}
    if count is None:
        says = [gname(g) for g, _ in table]
        says.append(count_word(table[0][1]))
        never = []
    else:
        cut = table[count - 1][1]
        # parties sure to be in the top `count` (strictly above any tie at the cut-off)
        above = [g for g, n in table if n > cut] if sum(1 for _, n in table if n >= cut) > count else \
            [g for g, n in table if n >= cut]
        says = [gname(g) for g in above] + [count_word(table[0][1])]
        never = [gname(g) for g, n in table if n < cut]
    return dict(intent="seat_totals", slots=slots, outcome="answered", focus=focus, says=says, never=never)


def count_progress(contest, with_pct=True, never_stale=False):
    says = [counted_pct(contest)] if with_pct else []
    never = []
    if never_stale and counted_pct(contest, BEFORE) != counted_pct(contest):
        never.append(counted_pct(contest, BEFORE))
    return dict(intent="count_progress", slots={"contest": contest}, outcome="answered", focus="status",
                says=says, never=never)


def candidate_result(cid, contest=None, focus="whether", votes_too=False):
    k, e = entry_of(cid)
    slots = {"competitor": cid}
    if contest:
        slots["contest"] = contest
    w = winner_entry(k)
    if w is None:
        return dict(intent="candidate_result", slots=slots, outcome="no_data", focus=focus)
    if w["competitor"] == cid:
        says = [ward(k)]
    else:
        says = [ordinal(e["place"])]
    if votes_too:
        says.append(e["mark"])
    return dict(intent="candidate_result", slots=slots, outcome="answered", focus=focus, says=says)


def open_races():
    opens = open_contests()
    return dict(intent="open_races", slots={}, outcome="answered", focus="open",
                says=[ward(k) for k in opens])


def clarify(intent, options=(), slots=None, focus="who"):
    return dict(intent=intent, slots=slots or {}, outcome="clarify", focus=focus, says=list(options))


def no_data(intent, focus="who", slots=None):
    return dict(intent=intent, slots=slots or {}, outcome="no_data", focus=focus)


def chat(intent):
    return dict(intent=intent, slots={}, outcome="answered", focus="chat")


def unc(focus="other", never=(), outcome="not_covered"):
    return dict(intent="none", outcome=outcome, focus=focus, never=list(never))


def gib():
    return dict(intent="none", outcome="not_understood", focus="other")


ASHV = [ward("ashvenny-north"), ward("ashvenny-south")]
BRANNICK = [name(c) for c in COMPETITORS if COMPETITORS[c]["family"] == "Brannick"]
assert len(BRANNICK) == 2


def Q(ask, label, *tags):
    d = {"ask": ask}
    d.update(label)
    t = list(tags)
    if d["outcome"] in ("not_covered", "not_understood") and "uncovered" not in t:
        t.append("uncovered")
    if d["outcome"] == "clarify" and "clarify" not in t:
        t.append("clarify")
    d["tags"] = t
    order = ["ask", "intent", "slots", "outcome", "focus", "says", "never", "tags"]
    out = {}
    for k in order:
        if k not in d:
            continue
        v = d[k]
        if k in ("says", "never", "tags") and not v:
            continue
        if k == "slots" and d["intent"] == "none":
            continue
        out[k] = v
    return out


def C(*turns, tags=()):
    return {"conversation": list(turns), "tags": ["conversation"] + list(tags)}


# ---------------------------------------------------------------- the set

CASES = [
    # ---------------- single questions: ward_winner
    Q("who won caddenmill?", ward_winner("caddenmill"), "exact"),
    Q("Who's taken Ashvenny North?", ward_winner("ashvenny-north", never_from=["ashvenny-south"]), "contraction"),
    Q("winner in pellin heath", ward_winner("pellin-heath"), "exact"),
    Q("who got elected up on the Heath", ward_winner("pellin-heath"), "partial", "chatty"),
    Q("gorse vane winner", ward_winner("gorsevane"), "voice", "mishearing"),
    Q("who won dun varick", ward_winner("dunvarrick"), "voice", "mishearing"),
    Q("Lanmouth town - who won it?", ward_winner("lanmouth"), "partial"),
    Q("who's the councillor for wrenlow sands now", ward_winner("wrenlow-sands"), "contraction"),
    Q("winner quellan x", ward_winner("quellan-cross"), "partial", "misspelling"),
    Q("marowby who won", ward_winner("marrowby"), "misspelling"),
    Q("did anyone take fenick green in the end", ward_winner("fennick-green"), "misspelling", "chatty"),
    Q("who won in tamsendale central", no_data("ward_winner", slots={}), "unknown_ward"),
    Q("who won ashvenny", clarify("ward_winner", ASHV), "ambiguous"),
    Q("who won?", clarify("ward_winner"), "missing_slot"),
    Q("who'd brindle quay go to last night", ward_winner("brindle-quay"), "relative_day", "contraction"),
    Q("the sands - who came out on top", ward_winner("wrenlow-sands"), "partial"),
    Q("hey quick q, has caddenmill got a winner declared", ward_winner("caddenmill"), "chatty"),

    # ---------------- ward_leader (leader and margin; trade words majority / gap / lead)
    Q("who's leading in wrenlow sands", ward_leader("wrenlow-sands", stale=True), "contraction"),
    Q("gap between first and second in quellan cross?", ward_leader("quellan-cross", focus="margin"), "exact"),
    Q("what was the majority in ashvenny south", ward_leader("ashvenny-south", focus="margin"), "exact"),
    Q("how big was Ilsa Rookhaven's majority", ward_leader("lanmouth", focus="margin"), "exact"),
    Q("caddenmill: who's out in front and what's the lead", ward_leader("caddenmill"), "contraction"),
    Q("margin in gorsevane?", ward_leader("gorsevane", focus="margin"), "exact"),
    Q("how close was dunvarick", ward_leader("dunvarrick", focus="margin"), "misspelling"),
    Q("brindle lead", ward_leader("brindle-quay"), "partial"),
    Q("by how many votes did Fianna Zellick win", ward_leader("pellin-heath", focus="margin"), "exact"),
    Q("whos in front in the lanmouth ward", ward_leader("lanmouth"), "contraction"),
    Q("how much did nevin corrigan win by", ward_leader("caddenmill", focus="margin"), "misspelling"),

    # ---------------- ward_results
    Q("full breakdown for gorsevane please", ward_results("gorsevane"), "exact"),
    Q("Lanmouth figures", ward_results("lanmouth"), "exact"),
    Q("can i get the votes for every candidate in fennick green", ward_results("fennick-green"), "exact"),
    Q("pellin heath numbers", ward_results("pellin-heath"), "exact"),
    Q("how did everyone do in dunvarrick", ward_results("dunvarrick"), "exact"),
    Q("results ashvenny sth", ward_results("ashvenny-south"), "partial", "misspelling"),
    Q("read me the result for brindle quay", ward_results("brindle-quay"), "voice"),
    Q("whats the result in caddenmill, with percentages", ward_results("caddenmill", shares=True), "contraction"),
    Q("quellan cross result", ward_results("quellan-cross"), "exact"),
    Q("marrowby standings pls", ward_results("marrowby"), "exact"),
    Q("results for ashvenny", clarify("ward_results", ASHV, focus="results"), "ambiguous"),
    Q("results for harrowgate ward", no_data("ward_results", focus="results"), "unknown_ward"),

    # ---------------- party_in_ward
    Q("how did harbour alliance get on in dunvarrick", party_in_ward("harbour", "dunvarrick"), "exact"),
    Q("MPR in Gorsevane?", party_in_ward("moorland", "gorsevane"), "partial", "abbreviation"),
    Q("how'd the lanterns do in lanmouth", party_in_ward("lantern", "lanmouth"), "contraction"),
    Q("greens result in ashvenny north", party_in_ward("greens", "ashvenny-north"), "partial"),
    Q("what did CGR poll in pellin heath", party_in_ward("greens", "pellin-heath", focus="mark",
                                                        what=("votes",)), "abbreviation"),
    Q("how many votes did the progressives get in quellan cross",
      party_in_ward("moorland", "quellan-cross", focus="mark", what=("votes",)), "partial"),
    Q("tollgate independants in dunvarrick", party_in_ward("tollgate", "dunvarrick"), "misspelling"),
    Q("how did the alliance fare in the sands", party_in_ward("harbour", "wrenlow-sands"), "partial"),
    Q("moreland progressives in caddenmill what share did they get",
      party_in_ward("moorland", "caddenmill", focus="mark", what=("share",)), "voice", "mishearing"),
    Q("greens in marrowby?", party_in_ward("greens", "marrowby"), "party_not_standing"),
    Q("how did harbour do in ashvenny", clarify("party_in_ward", ASHV, slots={"group": "harbour"},
                                                focus="how_did"), "ambiguous"),

    # ---------------- party_seats
    Q("how many seats for the lantern party", party_seats("lantern"), "exact"),
    Q("seats won by harbour alliance?", party_seats("harbour"), "exact"),
    Q("how many councillors have the greens got", party_seats("greens"), "partial"),
    Q("moorland progressives seat count", party_seats("moorland"), "exact"),
    Q("HAL seats", party_seats("harbour"), "abbreviation"),
    Q("how many seats did toll gate get", party_seats("tollgate"), "voice", "mishearing"),
    Q("how many seats did Labour win", no_data("party_seats", focus="count"), "unknown_party"),

    # ---------------- seat_totals
    Q("whats the overall picture in seats", seat_totals(), "contraction"),
    Q("seat tally across the council", seat_totals(), "exact"),
    Q("top 3 parties by seats", seat_totals(3), "constraint"),
    Q("who's winning the council overall", seat_totals(focus="who"), "contraction"),
    Q("give me the scoreboard, party by party", seat_totals(), "chatty"),

    # ---------------- count_progress
    Q("has gorsevane finished counting", count_progress("gorsevane"), "exact"),
    Q("percentage counted in lanmouth", count_progress("lanmouth"), "exact"),
    Q("how far through is the count in dunvarrick", count_progress("dunvarrick"), "exact"),
    Q("is wrenlow sands fully counted", count_progress("wrenlow-sands", never_stale=True), "exact"),
    Q("count progress ashvenny north", count_progress("ashvenny-north"), "exact"),
    Q("how far along is the count", clarify("count_progress", focus="status"), "missing_slot"),
    Q("has marrowby declared", count_progress("marrowby", with_pct=False), "trade_word"),

    # ---------------- candidate_result
    Q("did orla quenlow win", candidate_result("c01"), "exact"),
    Q("has Gaspard Torvane been elected?", candidate_result("c06"), "exact"),
    Q("did ivo oscary get in", candidate_result("c09"), "misspelling"),
    Q("is rhosyn dretholm a councillor now", candidate_result("c08"), "exact"),
    Q("did Delphy win", candidate_result("c02"), "partial"),
    Q("Corrigane won?", candidate_result("c12"), "partial"),
    Q("did caelan dunstreth win quellan cross", candidate_result("c37", "quellan-cross"), "exact"),
    Q("has Aldo Orrick taken gorsevane", candidate_result("c23", "gorsevane"), "exact"),
    Q("did mirela stellick make it", candidate_result("c27"), "exact"),
    Q("did rosamund vossary win", candidate_result("c30"), "voice", "mishearing"),
    Q("is fiona zelick elected", candidate_result("c33"), "voice", "mishearing"),
    Q("did Oswin win", candidate_result("c24"), "partial"),
    Q("did john smith win", no_data("candidate_result", focus="whether"), "unknown_candidate"),
    Q("was Tove Inglemarsh successful in wrenlow", candidate_result("c42", "wrenlow-sands"), "partial"),

    # ---------------- open_races
    Q("which wards haven't declared", open_races(), "contraction"),
    Q("any counts ongoing?", open_races(), "exact"),
    Q("what's left to come in", open_races(), "contraction"),
    Q("are we waiting on any more results", open_races(), "chatty"),

    # ---------------- chat
    Q("hello", chat("greeting"), "exact"),
    Q("good evening", chat("greeting"), "exact"),
    Q("help", chat("help"), "exact"),
    Q("what sort of things can i ask you", chat("help"), "chatty"),
    Q("thanks very much", chat("thanks"), "exact"),
    Q("cheers mate", chat("thanks"), "chatty"),

    # ---------------- uncovered singles
    Q("what was turnout across the county", unc(), "turnout"),
    Q("who came third in fennick green",
      unc(focus="who", never=[name(winner_entry("fennick-green")["competitor"])]), "constraint"),
    Q("who finished last in ashvenny north",
      unc(focus="who", never=[name(winner_entry("ashvenny-north")["competitor"])]), "constraint"),
    Q("which ward had the tightest race", unc(focus="margin")),
    Q("how many votes did the lantern party get county wide", unc(focus="mark")),
    Q("whats the swing from moorland to harbour since 2022", unc()),
    Q("how many seats did harbour win last time", unc(focus="count", never=[count_word(seats("harbour"))]),
      "constraint"),
    Q("who will lead the council now", unc(focus="who")),
    Q("how old is juna tullock", unc()),
    Q("what time did brindle quay declare", unc(focus="when")),
    Q("where is the gorsevane count being held", unc(focus="where")),
    Q("how many spoilt ballots in lanmouth", unc(focus="count")),
    Q("what's in the harbour alliance manifesto", unc()),
    Q("how many women won seats", unc(focus="count")),
    Q("whens the next council election", unc(focus="when")),
    Q("is there going to be a coalition", unc()),
    Q("what's the electorate in pellin heath", unc(focus="count")),
    Q("who got the second most votes in caddenmill",
      unc(focus="who", never=[name(winner_entry("caddenmill")["competitor"])]), "constraint"),
    Q("how many seats did the greens gain", unc(focus="count")),
    Q("how many candidates stood altogether", unc(focus="count")),
    Q("what was harbour's share of the vote overall", unc(focus="mark")),
    Q("play some music", gib(), "off_topic"),
    Q("blorp zzz kk", gib(), "gibberish"),
    Q("whats the score in the football", gib(), "off_topic"),

    # ---------------- conversations
    C(Q("hiya", chat("greeting"), "chatty"),
      Q("who took caddenmill", ward_winner("caddenmill"), "new_question"),
      Q("how big was the gap", ward_leader("caddenmill", focus="margin"), "follow_up", "trade_word"),
      Q("and who was runner up", unc(focus="who", never=[name(winner_entry("caddenmill")["competitor"])]),
        "follow_up", "constraint"),
      Q("ok thanks", chat("thanks"))),
    C(Q("how many seats have the progressives got", party_seats("moorland"), "partial"),
      Q("and harbour?", party_seats("harbour"), "follow_up", "ellipsis"),
      Q("what about the lanterns", party_seats("lantern"), "follow_up", "ellipsis"),
      Q("n tollgate", party_seats("tollgate"), "follow_up", "ellipsis", "misspelling")),
    C(Q("ashvenny result pls", clarify("ward_results", ASHV, focus="results"), "ambiguous"),
      Q("south", ward_results("ashvenny-south"), "follow_up", "ellipsis"),
      Q("how close was it between the top two", ward_leader("ashvenny-south", focus="margin"), "follow_up"),
      Q("and was all of it counted", count_progress("ashvenny-south"), "follow_up", "pronoun")),
    C(Q("did brannick hold her seat", clarify("candidate_result", BRANNICK, focus="whether"), "ambiguous",
        "partial"),
      Q("the one standing in pellin heath", candidate_result("c35", "pellin-heath"), "follow_up"),
      Q("who did win there then", ward_winner("pellin-heath"), "follow_up", "pronoun"),
      Q("what was her majority", ward_leader("pellin-heath", focus="margin"), "follow_up", "pronoun")),
    C(Q("who won in brindle key", ward_winner("brindle-quay"), "voice", "mishearing"),
      Q("how much had been counted when they called it", count_progress("brindle-quay"), "follow_up",
        "pronoun", "voice"),
      Q("what was the turnout there", unc(), "follow_up", "voice")),
    C(Q("Quick one: where do the parties stand on seats?", seat_totals(), "chatty"),
      Q("just the top two", seat_totals(2), "follow_up", "constraint", "number_words"),
      Q("how many has tollgate", party_seats("tollgate"), "follow_up"),
      Q("how did they do in gorsevane", party_in_ward("tollgate", "gorsevane"), "follow_up", "pronoun")),
    C(Q("are there any wards left to declare", open_races(), "exact"),
      Q("when did the last one come in", unc(focus="when"), "follow_up"),
      Q("who won wrenlow sands then", ward_winner("wrenlow-sands"), "new_question")),
    C(Q("how did the civic greens do in fennick green", party_in_ward("greens", "fennick-green"), "exact"),
      Q("and in lanmouth", party_in_ward("greens", "lanmouth"), "follow_up", "ellipsis"),
      Q("what share is that", party_in_ward("greens", "lanmouth", focus="mark", what=("share",)),
        "follow_up", "pronoun"),
      Q("thx", chat("thanks"), "misspelling")),
    C(Q("is Kesia Carravine in?", candidate_result("c36"), "chatty"),
      Q("who was second", unc(focus="who", never=[name("c36")]), "follow_up", "constraint"),
      Q("give me all the numbers for quellan", ward_results("quellan-cross"), "follow_up", "partial")),
    C(Q("evening all", chat("greeting"), "chatty"),
      Q("what can u do", chat("help"), "misspelling"),
      Q("ok who won gorsevane", ward_winner("gorsevane"), "new_question"),
      Q("harbour's vote share there?", party_in_ward("harbour", "gorsevane", focus="mark", what=("share",)),
        "follow_up", "pronoun")),
    C(Q("marrowby - who's ahead", ward_leader("marrowby"), "contraction"),
      Q("is it all in", count_progress("marrowby"), "follow_up", "pronoun"),
      Q("and pellin heath?", count_progress("pellin-heath"), "follow_up", "ellipsis")),
    C(Q("how did Pim Wystrel do", candidate_result("c20", focus="how_did"), "exact"),
      Q("who beat him", ward_winner("fennick-green"), "follow_up", "pronoun"),
      Q("by what margin", ward_leader("fennick-green", focus="margin"), "follow_up", "ellipsis")),
    C(Q("what's the weather like in lanmouth tonight", gib(), "off_topic"),
      Q("sorry, who won lanmouth", ward_winner("lanmouth"), "new_question"),
      Q("how did the moorland lot do there", party_in_ward("moorland", "lanmouth"), "follow_up", "pronoun")),
    C(Q("who's the new councillor for dunvarrick", ward_winner("dunvarrick"), "contraction"),
      Q("which party is he with", unc(focus="group_of"), "follow_up", "pronoun"),
      Q("how many seats have they won in total", party_seats("tollgate"), "follow_up", "pronoun")),
    C(Q("did the independents win anything", party_seats("tollgate", focus="whether"), "partial"),
      Q("what about in ashvenny south", party_in_ward("tollgate", "ashvenny-south"), "follow_up")),
    C(Q("who won wrenlow", ward_winner("wrenlow-sands"), "partial"),
      Q("what was the gap", ward_leader("wrenlow-sands", focus="margin", stale=True), "follow_up",
        "trade_word"),
      Q("and how many seats do the greens have now", party_seats("greens"), "new_question"),
      Q("back to wrenlow - give me the whole breakdown", ward_results("wrenlow-sands"), "follow_up",
        "return")),
    C(Q("can you tell me turnout in caddenmill", unc(), "exact"),
      Q("ok then who won it", ward_winner("caddenmill"), "follow_up", "pronoun"),
      Q("was it close", ward_leader("caddenmill", focus="margin"), "follow_up", "pronoun")),
    C(Q("who got in at the Quay", ward_winner("brindle-quay"), "partial"),
      Q("how'd the alliance do there", party_in_ward("harbour", "brindle-quay"), "follow_up", "pronoun"),
      Q("and the tollgate lot", party_in_ward("tollgate", "brindle-quay"), "follow_up", "ellipsis",
        "party_not_standing")),
    C(Q("has odile yellmer won", candidate_result("c03"), "exact"),
      Q("who did then", ward_winner("ashvenny-north", never_from=["ashvenny-south"]), "follow_up"),
      Q("whats the breakdown there", ward_results("ashvenny-north"), "follow_up", "pronoun")),
    C(Q("which party has the most councillors", seat_totals(1, focus="who"), "constraint"),
      Q("do they have a majority on the council", unc(focus="whether"), "follow_up", "pronoun"),
      Q("ah ok thanks anyway", chat("thanks"))),
    C(Q("hey there", chat("greeting")),
      Q("gorsevane leader?", ward_leader("gorsevane"), "partial"),
      Q("and dunvarrick", ward_leader("dunvarrick"), "follow_up", "ellipsis"),
      Q("what percentage is in for dunvarrick", count_progress("dunvarrick"), "follow_up")),
    C(Q("did sabeth pellagan hang on in ashvenny south", candidate_result("c05", "ashvenny-south"), "chatty"),
      Q("how many votes short was she", ward_leader("ashvenny-south", focus="margin"), "follow_up", "pronoun"),
      Q("is there a recount", unc(focus="status"), "follow_up")),
    C(Q("who won fennick", ward_winner("fennick-green"), "partial"),
      Q("and the greens overall how many", party_seats("greens"), "new_question"),
      Q("biggest winning margin of the night?", unc(focus="margin"), "new_question")),
    C(Q("what happened in marrow bee", ward_results("marrowby"), "voice", "mishearing"),
      Q("how did the lantern party do", party_in_ward("lantern", "marrowby"), "follow_up", "voice"),
      Q("what about in quillan cross", party_in_ward("lantern", "quellan-cross"), "follow_up", "voice",
        "mishearing")),
    C(Q("who's won ashvenny north", ward_winner("ashvenny-north", never_from=["ashvenny-south"]), "contraction"),
      Q("and the other ashvenny", ward_winner("ashvenny-south", never_from=["ashvenny-north"]), "follow_up"),
      Q("thank you so much", chat("thanks"), "thanks_between"),
      Q("one more - how many has harbour in all", party_seats("harbour"), "new_question")),
    C(Q("asdf qwer", gib(), "gibberish"),
      Q("sorry cat on keyboard. seats table please", seat_totals(), "new_question")),
    C(Q("how many seats did they get", clarify("party_seats", focus="count"), "missing_slot"),
      Q("the civic greens", party_seats("greens"), "follow_up")),
    C(Q("has yara glenvane won", candidate_result("c40"), "exact"),
      Q("what share of the ballots had been counted at the declaration", count_progress("wrenlow-sands", never_stale=True),
        "follow_up", "trade_word")),
    C(Q("hi im on the late desk", chat("greeting"), "chatty"),
      Q("did the alliance win caddenmill", party_in_ward("harbour", "caddenmill", focus="whether"),
        "whether_party"),
      Q("what about ulric fennow personally, did he get in", candidate_result("c13", "caddenmill"),
        "follow_up"),
      Q("cheers, and who was elected in quellan cross", ward_winner("quellan-cross"), "thanks_between",
        "new_question"),
      Q("how big was that win", ward_leader("quellan-cross", focus="margin"), "follow_up", "pronoun")),
    C(Q("two questions. first, who won pellin", ward_winner("pellin-heath"), "partial", "chatty"),
      Q("second, how many seats do the lanterns have", party_seats("lantern"), "new_question"),
      Q("and what were the votes in their best ward", unc(focus="mark"), "follow_up", "constraint")),
]



# ---------------------------------------------------------------- write & count

def turns():
    for c in CASES:
        if "conversation" in c:
            for t in c["conversation"]:
                yield t
        else:
            yield c


def main():
    header = (
        "# Blind question set: scenario election, moment 03:45\n"
        "# (clock 2027-05-07T03:45+01:00; replay batches 01-21 all applied)\n"
        "# Written by tests/eval/blind/round1/label_election_0345.py from dataset-demo/election/.\n"
        "# Do not edit by hand: change the script and re-run it.\n"
    )
    body = yaml.safe_dump(CASES, sort_keys=False, allow_unicode=True, width=120, default_flow_style=None)
    with open(OUT, "w", encoding="utf-8") as f:
        f.write(header + body)

    ts = list(turns())
    convs = [c for c in CASES if "conversation" in c]
    assert all(2 <= len(c["conversation"]) <= 6 for c in convs)
    unc_n = sum(1 for t in ts if t["outcome"] in ("not_covered", "not_understood"))
    by_intent, by_outcome = {}, {}
    for t in ts:
        by_intent[t["intent"]] = by_intent.get(t["intent"], 0) + 1
        by_outcome[t["outcome"]] = by_outcome.get(t["outcome"], 0) + 1
    print(f"turns: {len(ts)}  cases: {len(CASES)}  conversations: {len(convs)}  "
          f"conversation turns: {sum(len(c['conversation']) for c in convs)}")
    print(f"uncovered: {unc_n} ({100 * unc_n / len(ts):.1f}%)")
    print("by intent:", dict(sorted(by_intent.items(), key=lambda kv: -kv[1])))
    print("by outcome:", dict(sorted(by_outcome.items(), key=lambda kv: -kv[1])))
    # sanity: seat table, margins
    print("seats:", [(gname(g), n) for g, n in seat_table()], "open:", open_contests())


if __name__ == "__main__":
    main()
