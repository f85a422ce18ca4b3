#!/usr/bin/env python3
"""Blind question set for the election scenario at 03:45
(every replay batch applied, clock 2027-05-07T03:45+01:00).

Each turn holds the reader's message and its intended meaning as data
(intent, slots, focus, what is asked); every `says` / `never` fact is
computed from dataset-demo/election/ by label_election_0345_lib.py.
Writes election-0345.yaml next to this script.
"""

import os
import sys

import yaml

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from label_election_0345_lib import (Election, count_text, counted_text, ordinal,  # noqa: E402
                                     share_text, votes_text)

MOMENT = "2027-05-07T03:45:00+01:00"
OUT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "election-0345.yaml")

E = Election(MOMENT)

# short contest ids
AN, AS, BQ, CM, DV, FG = ("ashvenny-north", "ashvenny-south", "brindle-quay",
                          "caddenmill", "dunvarrick", "fennick-green")
GV, LM, MB, PH, QC, WS = ("gorsevane", "lanmouth", "marrowby", "pellin-heath",
                          "quellan-cross", "wrenlow-sands")


def T(ask, intent, slots=None, focus=None, tags=(), outcome="answered", what=None,
      options=None, never=None):
    """One turn.  `what` refines what is asked (e.g. 'share', 'party', 'votes');
    `options` are entity ids a clarify must offer; `never` is a function of
    the Election giving extra facts that must not appear."""
    return dict(ask=ask, intent=intent, slots=slots, focus=focus, tags=list(tags),
                outcome=outcome, what=what, options=options, never=never)


def C(*turns, tags=()):
    return dict(conversation=list(turns), tags=list(tags))


def _numeric(s):
    return any(ch.isdigit() for ch in s)


def compute(t):
    """Return (says, never) for a turn from the data."""
    intent, s, what, outcome = t["intent"], t["slots"] or {}, t["what"], t["outcome"]
    says, never = [], []
    if outcome == "clarify":
        for o in t["options"] or []:
            says.append(E.name(o) if o in E.people else E.ward_name(o))
    elif outcome == "answered":
        cid = s.get("contest")
        if intent == "ward_winner":
            w = E.winner(cid)
            says = [E.party_name(E.party_of(w))] if what == "party" else [E.name(w)]
        elif intent == "ward_leader":
            says = [E.name(E.leader(cid)), votes_text(E.lead_margin(cid))]
        elif intent == "ward_results":
            tot = E.total(cid)
            for e in E.ranked(cid):
                if what == "share":
                    says += [E.name(e["competitor"]), share_text(E.votes(e), tot)]
                elif what == "votes":
                    says += [e["mark"]]
                    break
                elif what == "share_of":
                    if e["competitor"] == s_extra(t):
                        says += [share_text(E.votes(e), tot)]
                else:
                    says += [E.name(e["competitor"]), e["mark"]]
            never += E.stale_marks(cid)
        elif intent == "ward_place":
            pid = E.at_place(cid, int(s["place"]))
            says = [E.name(pid)]
            if what == "votes":
                says.append(E.entry(pid)["mark"])
        elif intent == "count_progress":
            says = [counted_text(E.counted(cid))]
            never += E.stale_counted(cid)
        elif intent == "candidate_result":
            pid = s["competitor"]
            e = E.entry(pid)
            if what == "votes":
                says = [e["mark"]]
            else:
                says = [E.ward_name(E.contest_of(pid))]
                if E.winner(E.contest_of(pid)) != pid:
                    says.append(ordinal(e["place"]))
        elif intent == "candidate_margin":
            m, other = E.margin_of(s["competitor"])
            says = [votes_text(m), E.name(other)]
        elif intent == "candidate_party":
            pid = s["competitor"]
            says = [E.party_name(E.party_of(pid)), E.ward_name(E.contest_of(pid))]
        elif intent == "candidates_compared":
            a, b = s["competitor"], s["rival"]
            ahead = a if E.entry(a)["place"] < E.entry(b)["place"] else b
            says = [E.name(ahead)]
        elif intent == "party_in_ward":
            e = E.party_entry(s["group"], cid)
            says = [E.name(e["competitor"])]
            if what == "share":
                says.append(share_text(E.votes(e), E.total(cid)))
            elif what == "place":
                says.append(ordinal(e["place"]))
            else:
                says.append(e["mark"])
        elif intent == "party_seats":
            says = [count_text(E.seats(s["group"]))]
        elif intent == "seat_totals":
            rows = E.seat_table()
            n = int(s["count"]) if "count" in s else len(rows)
            # include every party tied with the n-th
            cut = rows[n - 1][1] if n <= len(rows) else 0
            shown = [r for r in rows if r[1] >= cut]
            hidden = [r for r in rows if r[1] < cut]
            top_named = rows[:n] if len(shown) == n else [r for r in rows if r[1] > cut]
            for gid, k in top_named:
                says += [E.party_name(gid), count_text(k)]
            never += [E.party_name(gid) for gid, _ in hidden]
        elif intent in ("open_races", "greeting", "help", "thanks"):
            if intent == "open_races":
                opened = E.open_contests()
                says = [E.ward_name(c) for c in opened]
        else:
            raise ValueError(f"no fact rule for {intent}")
    if t["never"]:
        never += t["never"](E)
    # a numeric `never` may not be part of a fact that a correct reply may hold
    allowed = set(says)
    cids = [s["contest"]] if s.get("contest") else []
    for c in cids:
        allowed |= {e["mark"] for e in E.ranked(c)}
        allowed |= {share_text(E.votes(e), E.total(c)) for e in E.ranked(c)}
        allowed.add(votes_text(E.lead_margin(c)))
        allowed.add(counted_text(E.counted(c)))
    never = [n for n in dict.fromkeys(never)
             if not (_numeric(n) and any(n.lower() in a.lower() for a in allowed))
             and n not in says]
    return says, never


def s_extra(t):
    return t["what_pid"]


def TS(ask, contest, pid, tags=(), focus="mark"):
    """ward_results turn asking the share of one entrant."""
    t = T(ask, "ward_results", {"contest": contest}, focus, tags, what="share_of")
    t["what_pid"] = pid
    return t


def NC(ask, tags=(), focus="other", never=None):
    return T(ask, "none", None, focus, ("uncovered",) + tuple(tags), outcome="not_covered", never=never)


def NU(ask, tags=(), focus="other"):
    return T(ask, "none", None, focus, tags, outcome="not_understood")


seats_by_1am = lambda E: [count_text(E.seats("moorland"))] if E.seats("moorland", by="2027-05-07T01:00:00+01:00") != E.seats("moorland") else []
harbour_civic = lambda E: [count_text(E.seats("harbour"))] if sum(1 for c in E.contests if E.contests[c]["venue"] == "Tamsendale Civic Hall" and E.party_of(E.winner(c)) == "harbour") != E.seats("harbour") else []

CASES = [
    # --- conversations -------------------------------------------------
    C(T("hi there", "greeting", {}, "chat", ["chatty"]),
      T("did my mum orla win her seat", "candidate_result", {"competitor": "c01"}, "whether", ["partial", "chatty", "contraction"]),
      T("by how many votes", "candidate_margin", {"competitor": "c01", "contest": AN}, "margin", ["follow_up", "ellipsis"]),
      T("who was she up against in second", "ward_place", {"contest": AN, "place": "2"}, "who", ["follow_up", "pronoun"]),
      T("aw thats brilliant thank you", "thanks", {}, "chat", ["chatty", "contraction"]),
      tags=["family"]),
    C(T("seat totals please, all parties", "seat_totals", {}, "table", ["exact"]),
      T("just the top two", "seat_totals", {"count": "2"}, "table", ["follow_up", "ellipsis", "number_words", "constraint"]),
      NC("whats the combined vote for moorland across all 12 wards", ["contraction", "constraint"]),
      T("ok and how many seats did the Progressives take", "party_seats", {"group": "moorland"}, "count", ["follow_up", "partial"]),
      T("what share of the vote did they get in marrowby", "party_in_ward", {"group": "moorland", "contest": MB}, "mark", ["follow_up", "pronoun"], what="share"),
      tags=["journalist"]),
    C(T("who won in cadden mill", "ward_winner", {"contest": CM}, "who", ["voice", "mishearing"]),
      T("what party is he with", "candidate_party", {"competitor": "c12"}, "group_of", ["voice", "follow_up", "pronoun"]),
      T("how close was it", "candidate_margin", {"competitor": "c12", "contest": CM}, "margin", ["voice", "follow_up", "pronoun"]),
      T("and who took kellan cross", "ward_winner", {"contest": QC}, "who", ["voice", "mishearing", "new_question"]),
      NC("was that a gain from last time", ["voice", "follow_up", "pronoun"]),
      tags=["voter"]),
    C(T("how much of the vote has been counted in wrenlow sands", "count_progress", {"contest": WS}, "status", ["exact"]),
      T("so whos won it", "ward_winner", {"contest": WS}, "who", ["follow_up", "pronoun", "contraction"],
        never=lambda E: E.stale_marks(WS)),
      T("by how much", "candidate_margin", {"competitor": "c40", "contest": WS}, "margin", ["follow_up", "ellipsis"]),
      NC("what time was it declared", ["follow_up", "pronoun"], focus="when"),
      T("were the greens ahead of the harbour candidate there", "candidates_compared", {"competitor": "c40", "rival": "c41", "contest": WS}, "compare", ["follow_up", "partial"]),
      tags=["student"]),
    C(T("did brannick get elected", "candidate_result", {}, "whether", ["ambiguous", "partial"], outcome="clarify", options=["c07", "c35"]),
      T("the one for the greens", "candidate_result", {"competitor": "c07"}, "whether", ["follow_up", "clarify"]),
      T("and the other brannick", "candidate_result", {"competitor": "c35"}, "whether", ["follow_up", "partial"]),
      T("which party is quilla with", "candidate_party", {"competitor": "c35"}, "group_of", ["follow_up", "partial"]),
      tags=["voter"]),
    C(T("whos winning in ashvenny", "ward_leader", {}, "who", ["ambiguous", "partial", "contraction"], outcome="clarify", options=[AN, AS]),
      T("south", "ward_leader", {"contest": AS}, "who", ["follow_up", "clarify", "ellipsis"]),
      T("and the north?", "ward_leader", {"contest": AN}, "who", ["follow_up", "ellipsis"]),
      T("is that one finished counting", "count_progress", {"contest": AN}, "status", ["follow_up", "pronoun"]),
      tags=["voter"]),
    C(T("pelling heath results", "ward_results", {"contest": PH}, "results", ["voice", "mishearing"]),
      T("how much of the vote has been counted there", "count_progress", {"contest": PH}, "status", ["voice", "follow_up"]),
      T("who came last", "ward_place", {"contest": PH, "place": "3"}, "who", ["voice", "follow_up", "ellipsis"]),
      NC("is there going to be a recount", ["voice", "follow_up"], focus="status"),
      tags=["voter"]),
    C(T("my cousin juna is standing for the civic greens did she get in", "candidate_result", {"competitor": "c19"}, "whether", ["chatty", "partial"]),
      T("brilliant what was her majority", "candidate_margin", {"competitor": "c19", "contest": FG}, "margin", ["follow_up", "pronoun", "chatty"]),
      T("how many votes did she get altogether", "candidate_result", {"competitor": "c19", "contest": FG}, "mark", ["follow_up", "pronoun"], what="votes"),
      T("thanks so much", "thanks", {}, "chat", ["thanks_between"]),
      T("oh one more, how many seats have the greens got in total", "party_seats", {"group": "greens"}, "count", ["new_question", "partial"]),
      tags=["family"]),
    C(T("gorsvane winnner?", "ward_winner", {"contest": GV}, "who", ["misspelling"]),
      T("winning margin pls", "candidate_margin", {"competitor": "c23", "contest": GV}, "margin", ["follow_up", "ellipsis"]),
      T("how did tollgate do there", "party_in_ward", {"group": "tollgate", "contest": GV}, "how_did", ["follow_up", "partial"]),
      NC("what was turnout", ["follow_up", "ellipsis"], focus="mark"),
      tags=["journalist"]),
    C(T("in ashvenny south who finished ahead, torvane or pellagan", "candidates_compared", {"competitor": "c06", "rival": "c05", "contest": AS}, "compare", ["partial"]),
      NC("was pellagan ahead earlier in the night", ["follow_up", "partial"], focus="compare"),
      T("how many did she lose by", "candidate_margin", {"competitor": "c05", "contest": AS}, "margin", ["follow_up", "pronoun"]),
      tags=["journalist"]),
    C(T("any wards still counting", "open_races", {}, "open", []),
      NC("which was the last one to declare", ["follow_up"], focus="when"),
      T("whats the overall picture seats wise", "seat_totals", {}, "table", ["contraction", "chatty"]),
      tags=["voter"]),
    C(T("who won lanmouth town", "ward_winner", {"contest": LM}, "who", ["partial"]),
      T("whats the full breakdown", "ward_results", {"contest": LM}, "results", ["follow_up", "contraction"]),
      T("was that 100 percent counted", "count_progress", {"contest": LM}, "status", ["follow_up", "pronoun"]),
      T("how did the harbour alliance do", "party_in_ward", {"group": "harbour", "contest": LM}, "how_did", ["follow_up", "ellipsis"], what="place"),
      tags=["voter"]),
    C(T("did fenwick win", "candidate_result", {"competitor": "c18"}, "whether", ["partial"]),
      T("who did win there then", "ward_winner", {"contest": DV}, "who", ["follow_up"]),
      T("which party is he", "candidate_party", {"competitor": "c16"}, "group_of", ["follow_up", "pronoun"]),
      T("is that the only seat tollgate won", "party_seats", {"group": "tollgate"}, "count", ["follow_up", "partial"]),
      tags=["student"]),
    C(T("who won", "ward_winner", {}, "who", ["missing_slot"], outcome="clarify"),
      T("marrowby", "ward_winner", {"contest": MB}, "who", ["follow_up", "clarify", "ellipsis"]),
      T("and who came second there", "ward_place", {"contest": MB, "place": "2"}, "who", ["follow_up"]),
      T("what about brindle key", "ward_place", {"contest": BQ, "place": "2"}, "who", ["follow_up", "ellipsis", "mishearing"]),
      tags=["voter"]),
    C(T("how much is counted", "count_progress", {}, "status", ["missing_slot"], outcome="clarify"),
      T("dunvarrick", "count_progress", {"contest": DV}, "status", ["follow_up", "clarify", "ellipsis"]),
      T("and gorsevane", "count_progress", {"contest": GV}, "status", ["follow_up", "ellipsis"]),
      tags=["journalist"]),
    C(T("who came third in quellan cross", "ward_place", {"contest": QC, "place": "3"}, "who", []),
      T("and fourth", "ward_place", {"contest": QC, "place": "4"}, "who", ["follow_up", "ellipsis", "number_words"]),
      T("what party's he from", "candidate_party", {"competitor": "c39"}, "group_of", ["follow_up", "pronoun", "contraction"]),
      NC("how old is he", ["follow_up", "pronoun"]),
      tags=["student"]),
    C(T("how did the lanterns get on in wrenlow", "party_in_ward", {"group": "lantern", "contest": WS}, "how_did", ["partial", "chatty"], outcome="no_data",
        never=lambda E: [E.name(E.winner(WS))]),
      T("ok who did win wrenlow then", "ward_winner", {"contest": WS}, "who", ["follow_up", "partial"]),
      T("thx", "thanks", {}, "chat", ["thanks_between"]),
      T("how many seats did lantern win overall", "party_seats", {"group": "lantern"}, "count", ["new_question", "partial"]),
      tags=["voter"]),
    C(NC("how many seats had moorland won by 1am", ["constraint", "number_words"], focus="count", never=seats_by_1am),
      T("and now", "party_seats", {"group": "moorland"}, "count", ["follow_up", "ellipsis"]),
      T("are they the biggest party", "seat_totals", {}, "rank", ["follow_up", "pronoun"]),
      NC("do they have a majority on the council", ["follow_up", "pronoun"], focus="whether"),
      tags=["journalist"]),
    C(T("what can you do", "help", {}, "chat", []),
      T("ok who's ahead in brindle quay", "ward_leader", {"contest": BQ}, "who", ["contraction"]),
      NU("whats the weather like tomorrow", ["relative_day"]),
      tags=["voter"]),
    C(T("give me vote shares in fennick green", "ward_results", {"contest": FG}, "results", [], what="share"),
      T("and caddenmill", "ward_results", {"contest": CM}, "results", ["follow_up", "ellipsis"], what="share"),
      T("whats the gap between first and second there", "ward_leader", {"contest": CM}, "margin", ["follow_up"]),
      NC("compare that to 2022", ["follow_up", "pronoun"], focus="compare"),
      tags=["journalist"]),
    C(T("who won the kellan cross seat", "ward_winner", {"contest": QC}, "who", ["voice", "mishearing"]),
      T("was it close", "candidate_margin", {"competitor": "c36", "contest": QC}, "margin", ["voice", "follow_up", "pronoun"]),
      T("who came second", "ward_place", {"contest": QC, "place": "2"}, "who", ["voice", "follow_up"]),
      T("what party is he", "candidate_party", {"competitor": "c37"}, "group_of", ["voice", "follow_up", "pronoun"]),
      T("and did the lantern candidate do any good", "party_in_ward", {"group": "lantern", "contest": QC}, "how_did", ["voice", "follow_up", "chatty"]),
      tags=["voter"]),
    C(T("hello im doing a school project on the council election", "greeting", {}, "chat", ["chatty", "contraction"]),
      T("which parties won seats", "seat_totals", {}, "table", []),
      NC("how many seats are there on the council altogether", ["follow_up"], focus="count"),
      T("how many did the greens win", "party_seats", {"group": "greens"}, "count", ["follow_up", "partial"]),
      NC("which of their candidates got the most votes", ["follow_up", "pronoun"], focus="who"),
      T("thank you", "thanks", {}, "chat", []),
      tags=["student"]),
    C(T("has gaspard torvane been elected", "candidate_result", {"competitor": "c06"}, "whether", ["exact"]),
      T("it was neck and neck earlier wasnt it, how much did he win by in the end", "candidate_margin", {"competitor": "c06", "contest": AS}, "margin", ["follow_up", "pronoun", "chatty", "contraction"]),
      T("full result please", "ward_results", {"contest": AS}, "results", ["follow_up"]),
      T("how much was counted", "count_progress", {"contest": AS}, "status", ["follow_up", "ellipsis"]),
      T("cheers", "thanks", {}, "chat", []),
      tags=["family"]),
    C(T("stellick or umbersley who got more", "candidates_compared", {"competitor": "c27", "rival": "c29"}, "compare", ["partial"]),
      T("and who beat both of them", "ward_winner", {"contest": LM}, "who", ["follow_up", "pronoun"]),
      T("by how much did she beat stellick", "candidate_margin", {"competitor": "c26", "contest": LM}, "margin", ["follow_up", "pronoun", "partial"]),
      NC("did she get more votes than anyone else in the whole county", ["follow_up", "pronoun", "constraint"], focus="compare"),
      tags=["journalist"]),
    C(T("wh won marowby", "ward_winner", {"contest": MB}, "who", ["misspelling"]),
      T("votes?", "ward_results", {"contest": MB}, "mark", ["follow_up", "ellipsis"], what="votes"),
      T("hw much countd", "count_progress", {"contest": MB}, "status", ["follow_up", "misspelling"]),
      T("lantern there?", "party_in_ward", {"group": "lantern", "contest": MB}, "how_did", ["follow_up", "ellipsis", "partial"]),
      tags=["journalist"]),
    C(T("who won brindle quay", "ward_winner", {"contest": BQ}, "who", ["exact"]),
      T("what about pellin heath", "ward_winner", {"contest": PH}, "who", ["follow_up", "ellipsis"]),
      T("going back to brindle quay, who came second", "ward_place", {"contest": BQ, "place": "2"}, "who", ["follow_up", "new_question"]),
      T("and by how much did she lose", "candidate_margin", {"competitor": "c10", "contest": BQ}, "margin", ["follow_up", "pronoun"]),
      tags=["return_to_subject"]),
    C(T("is anything still being counted right now", "open_races", {}, "open", []),
      T("how many seats does each party have then", "seat_totals", {}, "table", ["follow_up"]),
      NC("who won the very last ward to finish", ["follow_up"], focus="who"),
      T("whats the result in wrenlow", "ward_results", {"contest": WS}, "results", ["partial", "contraction"]),
      tags=["voter"]),
    C(T("how did the greens do in ashvenny south", "party_in_ward", {"group": "greens", "contest": AS}, "how_did", ["partial"]),
      T("and in ashvenny north", "party_in_ward", {"group": "greens", "contest": AN}, "how_did", ["follow_up", "ellipsis"]),
      T("who is their candidate in pellin", "party_in_ward", {"group": "greens", "contest": PH}, "who", ["follow_up", "pronoun", "partial"]),
      T("did she beat the moorland candidate there", "candidates_compared", {"competitor": "c34", "rival": "c35", "contest": PH}, "whether", ["follow_up", "pronoun"]),
      tags=["family"]),
    C(T("did sten lusk it win dunvarrick", "candidate_result", {"competitor": "c16", "contest": DV}, "whether", ["voice", "mishearing"]),
      T("how many votes ahead was he", "candidate_margin", {"competitor": "c16", "contest": DV}, "margin", ["voice", "follow_up", "pronoun"]),
      NC("how many postal votes were there", ["voice", "follow_up"], focus="count"),
      tags=["voter"]),
    C(T("ok so i went to bed at ten and missed everything, can you just tell me where things stand with the seats", "seat_totals", {}, "table", ["chatty"]),
      T("right so how many did moorland win exactly", "party_seats", {"group": "moorland"}, "count", ["follow_up", "partial"]),
      T("and the harbour lot", "party_seats", {"group": "harbour"}, "count", ["follow_up", "ellipsis", "chatty"]),
      NC("did they lose anywhere by a whisker", ["follow_up", "pronoun", "chatty"], focus="margin"),
      T("ok and ashvenny south, who was second there", "ward_place", {"contest": AS, "place": "2"}, "who", ["new_question"]),
      tags=["voter"]),
    C(T("talia yarrowby party?", "candidate_party", {"competitor": "c32"}, "group_of", []),
      T("did she win", "candidate_result", {"competitor": "c32", "contest": MB}, "whether", ["follow_up", "pronoun"]),
      T("who won it then", "ward_winner", {"contest": MB}, "who", ["follow_up", "pronoun"]),
      NC("whats his email address", ["follow_up", "pronoun"]),
      tags=["voter"]),
    C(T("Who was elected in Gorsevane?", "ward_winner", {"contest": GV}, "who", ["exact"]),
      T("How many votes did the runner-up get?", "ward_place", {"contest": GV, "place": "2"}, "mark", ["follow_up"], what="votes"),
      TS("What percentage of the vote was that?", GV, "c24", ["follow_up", "pronoun"]),
      tags=["student"]),
    C(NC("what was the turnout in quellan cross", [], focus="mark"),
      NC("ok how many voters are registered there", ["follow_up"], focus="count"),
      T("fine, who won it", "ward_winner", {"contest": QC}, "who", ["follow_up", "pronoun"]),
      T("thanks", "thanks", {}, "chat", []),
      tags=["journalist"]),
    C(T("ashvenny north full results please", "ward_results", {"contest": AN}, "results", []),
      T("how did odile yellmer do", "candidate_result", {"competitor": "c03", "contest": AN}, "how_did", ["follow_up"]),
      T("what share did she get", "party_in_ward", {"group": "lantern", "contest": AN}, "mark", ["follow_up", "pronoun"], what="share"),
      NC("is she standing again next time", ["follow_up", "pronoun"]),
      tags=["student"]),
    C(T("who came last in caddenmill", "ward_place", {"contest": CM, "place": "4"}, "who", ["constraint"]),
      T("what party is she", "candidate_party", {"competitor": "c15"}, "group_of", ["follow_up", "pronoun"]),
      T("how many seats did her party win", "party_seats", {"group": "lantern"}, "count", ["follow_up", "pronoun"]),
      tags=["student"]),
    C(T("quellan x result", "ward_results", {"contest": QC}, "results", ["partial", "misspelling"]),
      T("margin", "candidate_margin", {"competitor": "c36", "contest": QC}, "margin", ["follow_up", "ellipsis"]),
      T("counted?", "count_progress", {"contest": QC}, "status", ["follow_up", "ellipsis"]),
      T("dunstreth vs elsmyre", "candidates_compared", {"competitor": "c37", "rival": "c38", "contest": QC}, "compare", ["follow_up", "partial"]),
      tags=["journalist"]),
    C(T("whos the new councillor in fennick", "ward_winner", {"contest": FG}, "who", ["partial", "contraction"]),
      T("what about the sands", "ward_winner", {"contest": WS}, "who", ["follow_up", "ellipsis", "partial"]),
      T("and the heath", "ward_winner", {"contest": PH}, "who", ["follow_up", "ellipsis", "partial"]),
      T("did the alliance win that one", "party_in_ward", {"group": "harbour", "contest": PH}, "whether", ["follow_up", "pronoun", "partial"], what="place"),
      tags=["voter"]),
    C(T("who came in at number two in gorsevane", "ward_place", {"contest": GV, "place": "2"}, "who", ["number_words"]),
      T("and number three", "ward_place", {"contest": GV, "place": "3"}, "who", ["follow_up", "ellipsis", "number_words"]),
      T("how many votes behind the winner was he", "candidate_margin", {"competitor": "c25", "contest": GV}, "margin", ["follow_up", "pronoun"]),
      tags=["student"]),
    C(NC("what time did the count start in lanmouth", [], focus="when"),
      NC("where was it held", ["follow_up", "pronoun"], focus="where"),
      T("ok whatever, who won", "ward_winner", {"contest": LM}, "who", ["follow_up", "chatty"]),
      tags=["voter"]),
    C(T("is aldo orrick ahead of oswin pembrev", "candidates_compared", {"competitor": "c23", "rival": "c24"}, "compare", ["exact"]),
      T("by how many", "candidate_margin", {"competitor": "c23", "contest": GV}, "margin", ["follow_up", "ellipsis"]),
      T("what party is pembrev", "candidate_party", {"competitor": "c24"}, "group_of", ["follow_up", "partial"]),
      tags=["journalist"]),
    C(NC("whats the difference between a ward and a seat", ["contraction"]),
      T("ok have all the wards declared now", "open_races", {}, "open", ["follow_up"]),
      T("how many seats did the civic greens get", "party_seats", {"group": "greens"}, "count", []),
      tags=["student"]),
    C(T("morning, who won ashvenny", "ward_winner", {}, "who", ["ambiguous", "partial", "relative_day"], outcome="clarify", options=[AN, AS]),
      T("the north ward", "ward_winner", {"contest": AN}, "who", ["follow_up", "clarify"]),
      T("and how did the progressives do there", "party_in_ward", {"group": "moorland", "contest": AN}, "how_did", ["follow_up", "partial"]),
      T("thanks love", "thanks", {}, "chat", ["thanks_between", "chatty"]),
      T("now the south one, who came third", "ward_place", {"contest": AS, "place": "3"}, "who", ["new_question", "partial"]),
      T("and what party is she in", "candidate_party", {"competitor": "c07"}, "group_of", ["follow_up", "pronoun"]),
      tags=["family"]),
    C(T("fiona zellick did she win", "candidate_result", {"competitor": "c33"}, "whether", ["voice", "mishearing"]),
      T("by how much", "candidate_margin", {"competitor": "c33", "contest": PH}, "margin", ["voice", "follow_up", "ellipsis"]),
      T("and how much of pellin heath has actually been counted", "count_progress", {"contest": PH}, "status", ["voice", "follow_up"]),
      NC("so could the rest of the votes change the result", ["voice", "follow_up"], focus="whether"),
      tags=["voter"]),
    C(T("keziah caravine", "candidate_result", {"competitor": "c36"}, "profile", ["voice", "mishearing", "ellipsis"]),
      T("what party", "candidate_party", {"competitor": "c36"}, "group_of", ["voice", "follow_up", "ellipsis"]),
      T("and who was the nearest challenger", "ward_place", {"contest": QC, "place": "2"}, "who", ["voice", "follow_up"]),
      T("how many votes did he end up with", "ward_place", {"contest": QC, "place": "2"}, "mark", ["voice", "follow_up", "pronoun"], what="votes"),
      tags=["voter"]),
    C(T("how are the tollgate independents doing", "party_seats", {"group": "tollgate"}, "how_did", []),
      T("did they stand in caddenmill", "party_in_ward", {"group": "tollgate", "contest": CM}, "whether", ["follow_up", "pronoun"], outcome="no_data",
        never=lambda E: [E.name(E.winner(CM))]),
      T("what about ashvenny south", "party_in_ward", {"group": "tollgate", "contest": AS}, "how_did", ["follow_up", "ellipsis"], what="place"),
      T("ok and the overall seat count", "seat_totals", {}, "table", ["new_question"]),
      tags=["journalist"]),
    C(T("who's leading in dunvarrick", "ward_leader", {"contest": DV}, "who", ["contraction"]),
      NC("how many votes were rejected there", ["follow_up"], focus="count"),
      T("give me the whole result", "ward_results", {"contest": DV}, "results", ["follow_up"]),
      T("was ameline rennow ahead of fenwick savrelle", "candidates_compared", {"competitor": "c17", "rival": "c18", "contest": DV}, "compare", ["follow_up"]),
      tags=["journalist"]),
    C(T("hey", "greeting", {}, "chat", []),
      T("result for the quay please", "ward_results", {"contest": BQ}, "results", ["partial"]),
      T("is it all counted", "count_progress", {"contest": BQ}, "status", ["follow_up", "pronoun"]),
      NC("why did they declare before the end then", ["follow_up", "pronoun"]),
      tags=["voter"]),

    # --- single questions ---------------------------------------------
    T("who won the quay", "ward_winner", {"contest": BQ}, "who", ["partial"]),
    T("orla can low result", "candidate_result", {"competitor": "c01"}, "how_did", ["voice", "mishearing"]),
    T("what party is delphy vardisse", "candidate_party", {"competitor": "c02"}, "group_of", ["exact"]),
    T("is nevin corrigane ahead of ulric fennow", "candidates_compared", {"competitor": "c12", "rival": "c13"}, "compare", ["exact"]),
    T("results for the heath pls", "ward_results", {"contest": PH}, "results", ["partial"]),
    T("the sands full result", "ward_results", {"contest": WS}, "results", ["partial"]),
    T("How many seats has the Harbour Alliance won so far?", "party_seats", {"group": "harbour"}, "count", ["exact"]),
    T("seats for the independents", "party_seats", {"group": "tollgate"}, "count", ["partial"]),
    T("top 2 parties by seats", "seat_totals", {"count": "2"}, "table", ["constraint"]),
    NC("what was the turnout across the county", [], focus="mark"),
    NC("who got the most votes of any candidate tonight", ["constraint"], focus="who"),
    NC("closest result of the night?", [], focus="margin"),
    NC("which ward had the biggest winning margin", [], focus="margin"),
    NC("when is the next county council election", [], focus="when"),
    NC("how many women got elected", ["constraint"], focus="count"),
    NC("where was the caddenmill count", [], focus="where"),
    NU("asdf jkl"),
    T("who is yara glenvane", "candidate_party", {"competitor": "c40"}, "profile", ["exact"]),
    T("did the moorland progressives win in ashvenny north", "party_in_ward", {"group": "moorland", "contest": AN}, "whether", [], what="place"),
    T("how did Lowen Abernell get on", "candidate_result", {"competitor": "c34"}, "how_did", ["chatty"]),
    T("did kesia carravine beat caelan dunstreth", "candidates_compared", {"competitor": "c36", "rival": "c37"}, "whether", []),
    T("whos leading the count in gorse vein", "ward_leader", {"contest": GV}, "who", ["voice", "mishearing"]),
    T("rosamund vossery marrowby majority", "candidate_margin", {"competitor": "c30", "contest": MB}, "margin", ["misspelling"]),
    T("what did the greens get in caddenmill", "party_in_ward", {"group": "greens", "contest": CM}, "how_did", ["partial"]),
    T("percentage counted fennick green", "count_progress", {"contest": FG}, "status", []),
    T("who came 2nd in dunvarick", "ward_place", {"contest": DV, "place": "2"}, "who", ["misspelling"]),
    NC("what does the lantern party stand for", []),
    NC("who's going to be council leader now", ["contraction"], focus="who"),
    T("harbor alliance seats", "party_seats", {"group": "harbour"}, "count", ["misspelling"]),
    T("Did Harold Pinwright win?", "candidate_result", {}, "whether", [], outcome="no_data"),
    T("who won kestlewick ward", "ward_winner", {}, "who", [], outcome="no_data"),
    T("how many seats did labour win", "party_seats", {}, "count", [], outcome="no_data"),
    T("whats the vote share for the tollgate independents in quellan cross", "party_in_ward", {"group": "tollgate", "contest": QC}, "mark", ["contraction"], what="share"),
    NC("how many seats did harbour win in the wards counted at tamsendale civic hall", ["constraint"], focus="count", never=harbour_civic),
    NC("how many votes were spoilt in lanmouth", [], focus="count"),
    T("who won ashvenny north and by what margin", "ward_leader", {"contest": AN}, "margin", []),
    NU("tell me a joke"),
    T("hiya", "greeting", {}, "chat", []),
    NC("can you show me a map of the wards", []),
    T("is wrenlow sands still counting", "count_progress", {"contest": WS}, "status", []),
    T("has Kell Thrane won", "candidate_result", {"competitor": "c28"}, "whether", ["exact"]),
    T("whos the councillor for the heath now", "ward_winner", {"contest": PH}, "who", ["partial", "contraction"]),
    T("madoc quaddle vs oswin pembrev who did better", "candidates_compared", {"competitor": "c25", "rival": "c24"}, "compare", []),
    NC("how many candidates stood altogether", [], focus="count"),
    T("which party won wrenlow sands", "ward_winner", {"contest": WS}, "who", [], what="party"),
    T("ward result dunvarrick", "ward_results", {"contest": DV}, "results", ["terse"]),
    T("margin of victory in pellin heath", "ward_leader", {"contest": PH}, "margin", []),
    T("brisa halvesk what party", "candidate_party", {"competitor": "c11"}, "group_of", []),
    T("who came first in fennick green", "ward_place", {"contest": FG, "place": "1"}, "who", ["number_words"]),
    T("did wynn jessavy win fennick green", "candidate_result", {"competitor": "c22", "contest": FG}, "whether", []),
    T("hesper ambrel votes", "candidate_result", {"competitor": "c15"}, "mark", ["misspelling"], what="votes"),
    NC("which party got the most votes across all the wards", ["constraint"], focus="who"),
    NC("how many seats changed hands", [], focus="count"),
    T("hows it going in the sands", "ward_leader", {"contest": WS}, "how_did", ["partial", "contraction", "chatty"]),
    T("elric ivenhall", "candidate_result", {"competitor": "c21"}, "profile", ["ellipsis"]),
    T("which side is pim wystrel on", "candidate_party", {"competitor": "c20"}, "group_of", ["chatty"]),
    T("is ivo oscary ahead of nessa mirrowen", "candidates_compared", {"competitor": "c09", "rival": "c10"}, "compare", ["misspelling"]),
    NU("play some music"),
    NC("how many people voted in gorsevane", [], focus="count"),
]


def turn_out(t):
    says, never = compute(t)
    out = {"ask": t["ask"], "intent": t["intent"]}
    if t["intent"] != "none":
        out["slots"] = dict(t["slots"] or {})
    out["outcome"] = t["outcome"]
    out["focus"] = t["focus"]
    if says:
        out["says"] = says
    if never:
        out["never"] = never
    if t["tags"]:
        out["tags"] = t["tags"]
    return out


def main():
    cases, turns = [], 0
    for c in CASES:
        if "conversation" in c:
            assert 2 <= len(c["conversation"]) <= 6, c
            cases.append({"conversation": [turn_out(t) for t in c["conversation"]], "tags": c["tags"] + ["conversation"]})
            turns += len(c["conversation"])
        else:
            cases.append(turn_out(c))
            turns += 1
    all_turns = [t for c in cases for t in (c["conversation"] if "conversation" in c else [c])]
    none = sum(1 for t in all_turns if t["intent"] == "none")
    nc = sum(1 for t in all_turns if t["outcome"] == "not_covered")
    header = (
        "# Blind question set: scenario election, moment 03:45\n"
        f"# (all {len(E.batches)} replay batches applied, last {E.batches[-1]}; clock {MOMENT})\n"
        "# Written by tests/eval/blind/round7/label_election_0345.py (facts computed from dataset-demo/election/).\n"
        f"# {len(cases)} cases, {turns} turns, {none} with intent none ({nc} not_covered).\n"
    )
    with open(OUT, "w", encoding="utf-8") as fh:
        fh.write(header)
        yaml.safe_dump(cases, fh, sort_keys=False, allow_unicode=True, width=1000)
    print(f"{len(cases)} cases, {turns} turns, intent none {none} ({100.0 * none / turns:.1f}%), "
          f"not_covered {nc} ({100.0 * nc / turns:.1f}%)")


if __name__ == "__main__":
    main()
