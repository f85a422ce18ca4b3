#!/usr/bin/env python3
"""Blind question set: election scenario at 23:45 (replay batches 01-05 applied,
clock 2027-05-06T23:45+01:00).  Writes election-2345.yaml next to this script.

Every expected fact (`says`, `never`) is computed from dataset-demo/election/
by label_election_2345_lib.py; the questions and their intended meaning are
written here as data.
"""
import os
import sys

import yaml

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from label_election_2345_lib import (Builder, State, conversation, single,  # noqa: E402
                                     fmt_votes, ordinal)

MOMENT_BATCHES = 5
CLOCK = "2027-05-06T23:45:00+01:00"

S = State(MOMENT_BATCHES)
assert S.as_of == CLOCK, S.as_of
B = Builder(S)

AN, AS_, BQ, CM, DV, FG = ("ashvenny-north", "ashvenny-south", "brindle-quay",
                           "caddenmill", "dunvarrick", "fennick-green")
GV, LM, MB, PH, QC, WS = ("gorsevane", "lanmouth", "marrowby", "pellin-heath",
                          "quellan-cross", "wrenlow-sands")
V = "voice"


def lead_name(contest):
    return S.name(S.leader(contest))


def votes_s(cid):
    return fmt_votes(S.votes_of(cid))


CASES = []
add = CASES.append

# 1 voter in Ashvenny North, polite, with thanks at the end
add(conversation([
    B.greeting("hiya", tags=["chatty"]),
    B.ward_leader("whos winning in ashvenny north then", AN, tags=["contraction"]),
    B.count_progress("how much of it's been counted so far", AN, tags=["follow_up", "ellipsis"]),
    B.compared("and is orla still ahead of delphy", "c01", "c02", contest_slot=True,
               tags=["follow_up", "partial"]),
    B.thanks("cheers", tags=["chatty"]),
], tags=["follow_up"]))

# 2 local radio producer, terse, works down a ward
add(conversation([
    B.ward_results("Give me the full Brindle Quay numbers as they stand", BQ, tags=["exact"]),
    B.count_progress("how far through are they", BQ, tags=["follow_up", "pronoun"]),
    B.ward_place("who's third there", BQ, 3, tags=["follow_up", "ellipsis", "constraint"]),
    B.ward_place("same for Caddenmill", CM, 3, tags=["follow_up", "ellipsis"]),
    B.ward_results("ok and the full Caddenmill sheet", CM, tags=["follow_up"]),
], tags=["follow_up"]))

# 3 someone who just woke up
add(conversation([
    B.seat_totals("wait has anybody actually won a seat yet", focus="whether", tags=["chatty"]),
    B.open_races("so whats still up for grabs", tags=["follow_up", "chatty"]),
    B.ward_leader("ok whos leading in the sands", WS, tags=["partial", "follow_up"]),
    B.ward_leader("and quellan", QC, tags=["ellipsis", "partial", "follow_up"]),
    B.none("when are they meant to start counting those two", focus="when",
           tags=["follow_up", "pronoun"]),
], tags=["follow_up"]))

# 4 Civic Greens activist
add(conversation([
    B.party_in_ward("how are the greens getting on in fennick green", "greens", FG, tags=["partial"]),
    B.ward_leader("are we top there", FG, focus="whether", with_margin=False,
                  tags=["follow_up", "pronoun"]),
    B.ward_leader("by how much", FG, focus="margin", tags=["follow_up", "ellipsis"]),
    B.party_seats("how many seats have the greens got overall so far", "greens",
                  tags=["new_question"]),
    B.none("whats our total vote across the whole county", focus="mark",
           tags=["follow_up"]),
], tags=["follow_up"]))

# 5 single, typo
add(single(B.candidate_party("wot party is rosmund vossery", "c30", tags=["misspelling"])))

# 6 single, voice mishearing
add(single(B.candidate_party("which party is nessa mirror wen standing for", "c10",
                             tags=[V, "mishearing"])))

# 7 Brannick is ambiguous
add(conversation([
    B.clarify_person("how's brannick doing", "candidate_result", "brannick", tags=["partial"]),
    B.candidate_standing("the green one", "c07", extra=("place",), tags=["follow_up"]),
    B.candidate_margin("how far behind the leader is she", "c07", tags=["follow_up", "pronoun"]),
    B.thanks("ok thanks", tags=["chatty"]),
], tags=["clarify", "follow_up"]))

# 8 Ashvenny is ambiguous
add(conversation([
    B.clarify_ward("who's leading in ashvenny", "ward_leader", "ashvenny", tags=["partial"]),
    B.ward_leader("south", AS_, tags=["follow_up", "ellipsis"]),
    B.ward_leader("and north?", AN, tags=["follow_up", "ellipsis"]),
], tags=["clarify", "follow_up"]))

# 9 missing ward
add(conversation([
    B.missing("whos in front", "ward_leader"),
    B.ward_leader("gorsevane", GV, tags=["follow_up", "ellipsis"]),
    B.count_progress("thats tight. hows much counted", GV, tags=["follow_up", "misspelling"]),
], tags=["clarify", "follow_up"]))

# 10 Harbour Alliance activist touring wards
add(conversation([
    B.party_in_ward("how's the alliance doing in gorsevane", "harbour", GV, tags=["partial"]),
    B.party_in_ward("and in pellin heath", "harbour", PH, tags=["follow_up", "ellipsis"]),
    B.party_in_ward("what about dunvarrick", "harbour", DV, extra=("place",),
                    tags=["follow_up", "ellipsis"]),
    B.candidate_margin("ouch. who's beating fenwick there", "c18", contest_slot=True,
                       focus="who", who_only=True, tags=["follow_up", "partial"]),
    B.party_seats("seats for harbour so far?", "harbour", tags=["new_question", "partial"]),
], tags=["follow_up"]))

# 11 single, voice
add(single(B.ward_leader("hey tidings whos ahead in caddon mill", CM, tags=[V, "mishearing"])))

# 12 single, terse
add(single(B.ward_place("Caddenmill - who's 2nd?", CM, 2, tags=["constraint"])))

# 13 single, last place
add(single(B.ward_place("who's bottom of the pile in lanmouth", LM, 4,
                        tags=["chatty", "constraint"])))

# 14 single, place the ward does not have
add(single(B.ward_place("who is fifth in brindle quay", BQ, 5, tags=["number_words", "constraint"])))

# 15 help, then alias
add(conversation([
    B.help("what can you actually do", tags=["chatty"]),
    B.ward_leader("ok who's winning down the quay", BQ, tags=["partial", "follow_up"]),
    B.count_progress("is that with all the votes in", BQ, tags=["follow_up", "pronoun"]),
    B.ward_winner("so nobody's won it yet?", BQ, focus="whether", tags=["follow_up"]),
], tags=["follow_up"]))

# 16 single compare
add(single(B.compared("is kestrove ahead of yellmer", "c04", "c03", tags=["partial"])))

# 17 uncovered singles
add(single(B.none("what was the turnout like in lanmouth", tags=["constraint"])))
add(single(B.none("who won marrowby at the last election in 2022", focus="who",
                  tags=["constraint", "number_words"])))
add(single(B.none("who's ahead on postal votes in caddenmill", focus="who",
                  never=[lead_name(CM)], tags=["constraint"])))
add(single(B.none("where's the dunvarrick count being held", focus="where")))
add(single(B.none("how old is tove inglemarsh")))
add(single(B.gibberish("asdfgh jkl")))
add(single(B.gibberish("play me some radio one", tags=[V])))

# 18 a candidate-centred conversation
add(conversation([
    B.candidate_party("which ward is ilsa rookhaven standing in", "c26", what=("ward",),
                      focus="where", tags=["exact"]),
    B.candidate_standing("is she winning", "c26", focus="whether",
                         tags=["follow_up", "pronoun"]),
    B.candidate_margin("by how much", "c26", tags=["follow_up", "ellipsis"]),
    B.ward_place("who's second there", LM, 2, tags=["follow_up", "ellipsis", "constraint"]),
    B.candidate_party("what party is she", "c27", what=("party",),
                      tags=["follow_up", "pronoun"]),
], tags=["follow_up"]))

# 19 radio producer sweep of the late wards
add(conversation([
    B.ward_results("Producer here, need the Marrowby standings please", MB, tags=["chatty"]),
    B.count_progress("percent counted?", MB, tags=["follow_up", "ellipsis"]),
    B.count_progress("and pellin heath, same", PH, tags=["follow_up", "ellipsis"]),
    B.ward_results("give me the full pellin numbers too", PH, tags=["follow_up", "partial"]),
    B.ward_leader("who's leading wrenlow sands", WS, tags=["new_question"]),
], tags=["follow_up"]))

# 20 terse party-code singles
add(single(B.party_seats("MPR seats so far", "moorland", tags=["partial"])))
add(single(B.seat_totals("seat totals pls", tags=["misspelling"])))
add(single(B.seat_totals("top 3 parties on seats", count=3, tags=["constraint"])))
add(single(B.open_races("how many races are still undecided", as_count=True, focus="count")))
add(single(B.open_races("which wards havent declared yet", tags=["contraction"])))
add(single(B.party_seats("has tollgate won anything yet", "tollgate", focus="whether",
                         tags=["partial"])))

# 21 a party that has no candidate in the ward
add(single(B.party_in_ward("how are the independents doing in ashvenny north", "tollgate", AN,
                           tags=["partial"])))

# 22 typos
add(single(B.ward_leader("whos wining in dunvarick", DV, tags=["misspelling"])))
add(single(B.ward_results("full resluts fennick green", FG, tags=["misspelling"])))

# 23 voice: votes of a named candidate
add(single(B.candidate_standing("how many votes has gaspar tor vain got", "c06", focus="mark",
                                tags=[V, "mishearing"])))

# 24 nan in Gorsevane
add(conversation([
    B.candidate_won("evening! my nan lives in gorsevane and wants to know if aldo orrick's won",
                    "c23", tags=["chatty"]),
    B.compared("well is he at least ahead of the tollgate fella", "c23", "c24",
               contest_slot=True, tags=["follow_up", "pronoun", "chatty"]),
    B.candidate_margin("by how many votes", "c23", contest_slot=True,
                       tags=["follow_up", "ellipsis"]),
    B.thanks("lovely ta", tags=["chatty"]),
], tags=["follow_up"]))

# 25 woke up, lanterns in Brindle Quay
add(conversation([
    B.ward_winner("ugh fell asleep on the sofa. did the lanterns win brindle quay", BQ,
                  focus="whether", tags=["chatty", "partial"]),
    B.ward_leader("who's ahead there then", BQ, tags=["follow_up", "pronoun"]),
    B.candidate_party("is he one of theirs", "c09", what=("party",), focus="group_of",
                      tags=["follow_up", "pronoun"]),
], tags=["follow_up"]))

# 26 thanks in the middle, change of subject and return
add(conversation([
    B.ward_leader("who's leading caddenmill", CM, tags=["exact"]),
    B.ward_leader("how close is it", CM, focus="margin", tags=["follow_up", "pronoun"]),
    B.thanks("thanks", tags=["thanks_between"]),
    B.party_in_ward("unrelated but how are the greens doing in lanmouth", "greens", LM,
                    extra=("place",), tags=["new_question"]),
    B.count_progress("back to caddenmill - how much is counted there", CM,
                     tags=["follow_up"]),
], tags=["thanks_between", "new_question", "follow_up"]))

# 27 time-restricted questions (not covered)
add(single(B.none("who was leading in ashvenny north at eleven o'clock", focus="who",
                  never=[votes_s("c01")], tags=["constraint", "number_words"])))
add(single(B.none("how many votes did quenlow have an hour ago", focus="mark",
                  never=[votes_s("c01")], tags=["constraint", "partial"])))

# 28 wards the data does not have
add(single(B.ward_leader("who's ahead in lanmouth east", None, tags=["constraint"]) |
           {"never": [lead_name(LM)]}))
add(single(B.ward_results("results for tamsendale central please", None)))
add(single(B.candidate_party("which party is dafydd morgan standing for", None)))

# 29 voice, Pellin Heath
add(conversation([
    B.ward_leader("whos top in pelican heath", PH, tags=[V, "mishearing"]),
    B.candidate_party("what party is she with", S.leader(PH), what=("party",),
                      tags=[V, "follow_up", "pronoun"]),
    B.ward_place("and who's last", PH, 3, tags=[V, "follow_up", "ellipsis", "constraint"]),
    B.candidate_margin("how far off the lead is she", "c35", tags=[V, "follow_up", "pronoun"]),
], tags=[V, "follow_up"]))

# 30 Moorland activist
add(conversation([
    B.party_in_ward("hows moorland doing in caddenmill", "moorland", CM, tags=["partial"]),
    B.compared("is nevin ahead of ulric", "c12", "c13", contest_slot=True,
               tags=["follow_up", "partial"]),
    B.candidate_margin("how many votes in it", "c12", contest_slot=True,
                       tags=["follow_up", "ellipsis"]),
    B.party_in_ward("what about us in marrowby", "moorland", MB, tags=["follow_up", "pronoun"]),
    B.party_in_ward("and the progressives in wrenlow", "moorland", WS, tags=["partial"]),
    B.party_seats("how many seats have the progressives banked", "moorland", tags=["partial"]),
], tags=["follow_up"]))

# 31 voter in Marrowby, voice
add(conversation([
    B.ward_results("what's the result in marrow bee", MB, tags=[V, "mishearing"]),
    B.ward_winner("so who's won it", MB, tags=[V, "follow_up", "pronoun"]),
    B.count_progress("how much have they got through", MB, tags=[V, "follow_up"]),
    B.none("when will they declare", focus="when", tags=[V, "follow_up"]),
], tags=[V, "follow_up"]))

# 32 uncovered singles about the wider election
add(single(B.none("does the harbour alliance have a majority on the council", focus="whether")))
add(single(B.none("how many seats do you need to control tamsendale council", focus="count")))
add(single(B.none("who leads the lantern party")))
add(single(B.none("what did the civic greens promise about bus fares")))
add(single(B.none("is there going to be a recount in gorsevane", focus="whether")))
add(single(B.none("how many spoilt ballots were there in caddenmill", focus="count")))

# 33 compare via surnames, typos
add(single(B.compared("is torvane beating pellagan", "c06", "c05", tags=["partial"])))
add(single(B.compared("stellick vs rookhaven who's in front", "c27", "c26", tags=["partial"])))
add(single(B.compared("is yara glenvane ahead of joram hestermoor", "c40", "c41", tags=["exact"])))

# 34 places with number words
add(single(B.ward_place("who came second in ashvenny south", AS_, 2, tags=["constraint"])))
add(single(B.ward_place("who is in third place in fennick", FG, 3, with_votes=True,
                        tags=["partial", "constraint"])))
add(single(B.ward_place("number one in the heath right now", PH, 1, tags=["partial", "constraint"])))

# 35 count progress, various wordings
add(single(B.count_progress("what percentage of dunvarrick has been counted", DV)))
add(single(B.count_progress("are they done counting in ashvenny south", AS_, focus="status",
                            tags=["contraction"])))
add(single(B.count_progress("has counting started in quellan cross", QC, tags=[])))

# 36 candidate party, partial names
add(single(B.candidate_party("pembrev - which party", "c24", tags=["partial"])))
add(single(B.candidate_party("who is caelan dunstreth representing", "c37", tags=["exact"])))
add(single(B.candidate_party("brisa halvesk party and ward", "c11", tags=["exact"])))

# 37 shares
add(conversation([
    B.party_in_ward("what percentage of the vote has the harbour alliance got in ashvenny north",
                    "harbour", AN, extra=("share",), focus="how_did", tags=["exact"]),
    B.party_in_ward("and lantern", "lantern", AN, extra=("share",),
                    tags=["follow_up", "ellipsis"]),
    B.party_in_ward("and the greens?", "greens", AN, extra=("share", "place"),
                    tags=["follow_up", "ellipsis"]),
], tags=["follow_up"]))

# 38 candidate who has not won; won-wording margin
add(conversation([
    B.candidate_won("has sten lusketh won dunvarrick", "c16", contest_slot=True, tags=["exact"]),
    B.candidate_margin("by how much did he win it", "c16", contest_slot=True, won_wording=True,
                       tags=["follow_up", "pronoun"]),
    B.candidate_margin("ok how big is his lead right now then", "c16", contest_slot=True,
                       tags=["follow_up", "pronoun"]),
    B.candidate_standing("how many votes has ameline got", "c17", contest_slot=True,
                         focus="mark", tags=["follow_up", "partial"]),
], tags=["follow_up"]))

# 39 local radio, overview then uncovered restrictions
add(conversation([
    B.open_races("Quick one - which wards are still open?", tags=["chatty"]),
    B.none("which of those is the closest race", focus="margin", tags=["follow_up", "pronoun"]),
    B.none("and which ward has counted the most so far", focus="status", tags=["follow_up"]),
    B.ward_leader("fine, who's leading in gorsevane", GV, tags=["new_question"]),
    B.thanks("much appreciated", tags=["chatty"]),
], tags=["follow_up"]))

# 40 chatty voter in Wrenlow Sands
add(conversation([
    B.greeting("good evening", tags=["chatty"]),
    B.ward_results("i live in wren low sands whats happening there", WS, tags=[V, "mishearing"]),
    B.count_progress("have they even started counting", WS, tags=["follow_up"]),
    B.candidate_party("what party is perrin farrowgate", "c39", tags=["new_question"]),
    B.candidate_won("has he won", "c39", tags=["follow_up", "pronoun"]),
], tags=["follow_up"]))

# 41 Lantern activist
add(conversation([
    B.party_in_ward("lanterns in lanmouth town how we doing", "lantern", LM, tags=["partial"]),
    B.ward_leader("is that a lead", LM, focus="whether", tags=["follow_up", "pronoun"]),
    B.party_in_ward("the lanterns in fennick?", "lantern", FG, extra=("place",),
                    tags=["follow_up", "partial"]),
    B.candidate_margin("how far behind is pim", "c20", tags=["follow_up", "partial"]),
    B.party_seats("how many seats do the lanterns have", "lantern", tags=["partial"]),
    B.none("and how many did they have before tonight", focus="count",
           tags=["follow_up", "pronoun"]),
], tags=["follow_up"]))

# 42 voice questions with mishearings
add(single(B.ward_leader("who's leading in gorse vein", GV, tags=[V, "mishearing"])))
add(single(B.ward_results("results in dun varick please", DV, tags=[V, "mishearing"])))
add(single(B.candidate_standing("how is oral quenlow getting on", "c01", extra=("place",),
                                tags=[V, "mishearing"])))
add(single(B.candidate_party("what party is delfy vardis", "c02", tags=[V, "mishearing"])))
add(single(B.ward_leader("who's out in front in fennec green", FG, tags=[V, "mishearing"])))

# 43 seat table conversation
add(conversation([
    B.seat_totals("what's the state of the parties", tags=["chatty"]),
    B.party_seats("and the greens specifically", "greens", tags=["follow_up", "ellipsis"]),
    B.none("what share of the vote have they got countywide", focus="mark",
           tags=["follow_up", "pronoun"]),
    B.none("how does that compare with last time", focus="compare", tags=["follow_up", "pronoun"]),
], tags=["follow_up"]))

# 44 someone comparing two wards (not covered), then back
add(conversation([
    B.ward_leader("whos winning ashvenny south", AS_, tags=["contraction"]),
    B.none("is that closer than ashvenny north", focus="compare", tags=["follow_up", "pronoun"]),
    B.ward_leader("ok who's leading north then", AN, tags=["follow_up", "partial"]),
    B.candidate_margin("and how far ahead is sabeth", "c05", tags=["follow_up", "partial"]),
], tags=["follow_up"]))

# 45 full results then a place
add(conversation([
    B.ward_results("can I see the full Gorsevane result", GV, tags=["exact"]),
    B.ward_place("who's 3rd", GV, 3, tags=["follow_up", "ellipsis", "constraint"]),
    B.candidate_party("what party's he", "c25", what=("party",), tags=["follow_up", "pronoun"]),
    B.candidate_margin("how far behind the leader is he", "c25", tags=["follow_up", "pronoun"]),
], tags=["follow_up"]))

# 46 questions about people the data does not hold facts on
add(conversation([
    B.candidate_party("who's hesper ambrell", "c15", tags=["exact"]),
    B.none("is she a sitting councillor", focus="whether", tags=["follow_up", "pronoun"]),
    B.candidate_standing("how many votes has she got", "c15", focus="mark",
                         tags=["follow_up", "pronoun"]),
    B.none("what's her email", tags=["follow_up", "pronoun"]),
], tags=["follow_up"]))

# 47 voter in Quellan Cross
add(conversation([
    B.ward_leader("who's ahead in quelling cross", QC, tags=[V, "mishearing"]),
    B.ward_results("can i get the numbers anyway", QC, tags=["follow_up"]),
    B.candidate_party("which party is kesia carravine", "c36", tags=["new_question"]),
    B.none("where is the count for quellan", focus="where", tags=["partial"]),
], tags=["follow_up"]))

# 48 Tollgate supporter
add(conversation([
    B.party_in_ward("how are tollgate doing in dunvarrick", "tollgate", DV, extra=("place",),
                    tags=["partial"]),
    B.candidate_margin("how much are they ahead by", "c16", contest_slot=True,
                       tags=["follow_up", "pronoun"]),
    B.party_in_ward("and the independents in ashvenny south", "tollgate", AS_,
                    extra=("place",), tags=["partial", "follow_up"]),
    B.party_in_ward("gorsevane?", "tollgate", GV, extra=("place",),
                    tags=["follow_up", "ellipsis"]),
    B.compared("is oswin ahead of aldo", "c24", "c23", contest_slot=True,
               tags=["follow_up", "partial"]),
], tags=["follow_up"]))

# 49 gibberish + restart in a conversation
add(conversation([
    B.gibberish("hfhfhf"),
    B.help("sorry, what are you for", tags=["chatty"]),
    B.ward_leader("right then whos leading in lanmouth", LM, tags=["follow_up"]),
], tags=["follow_up"]))

# 50 Brannick the other way round
add(conversation([
    B.clarify_person("what party is brannick", "candidate_party", "brannick", focus="group_of",
                     tags=["partial"]),
    B.candidate_party("the one in pellin heath", "c35", tags=["follow_up"]),
    B.candidate_standing("and how's she doing", "c35", extra=("place",),
                         tags=["follow_up", "pronoun"]),
    B.compared("is she ahead of lowen abernell", "c35", "c34", tags=["follow_up", "pronoun"]),
], tags=["clarify", "follow_up"]))

# 51 restricted questions no intent takes
add(single(B.none("who's leading among the women candidates in fennick green", focus="who",
                  tags=["constraint"])))
add(single(B.none("which party is leading in the most wards", focus="who")))
add(single(B.none("who has the most votes of any candidate so far", focus="mark")))
add(single(B.none("how many people are registered to vote in brindle quay", focus="count")))
add(single(B.none("whats the swing from harbour to moorland in ashvenny south", focus="margin",
                  tags=["partial"])))

# 52 Ashvenny clarify answered by detail, then ward results
add(conversation([
    B.clarify_ward("how much has been counted in ashvenny", "count_progress", "ashvenny",
                   focus="status", tags=["partial"]),
    B.count_progress("the north one", AN, tags=["follow_up"]),
    B.count_progress("and the other", AS_, tags=["follow_up", "pronoun"]),
    B.ward_results("full results for that one please", AS_, tags=["follow_up", "pronoun"]),
], tags=["clarify", "follow_up"]))

# 53 missing slot for results
add(conversation([
    B.missing("give me the full results", "ward_results", focus="results"),
    B.ward_results("dunvarrick", DV, tags=["follow_up", "ellipsis"]),
    B.ward_place("who's second", DV, 2, tags=["follow_up", "ellipsis", "constraint"]),
], tags=["clarify", "follow_up"]))

# 54 missing slot for count progress
add(conversation([
    B.missing("how much is counted", "count_progress", focus="status"),
    B.count_progress("fennick green", FG, tags=["follow_up", "ellipsis"]),
    B.ward_leader("and whos ahead", FG, tags=["follow_up", "ellipsis"]),
], tags=["clarify", "follow_up"]))

# 55 missing slot for place
add(conversation([
    B.missing("who's in second place", "ward_place", slots={"place": "2"}, tags=["constraint"]),
    B.ward_place("marrowby", MB, 2, tags=["follow_up", "ellipsis"]),
    B.ward_place("and third", MB, 3, with_votes=True, tags=["follow_up", "ellipsis"]),
], tags=["clarify", "follow_up"]))

# 56 mixed chatty singles
add(single(B.ward_leader("sorry to bother you but could you tell me who is currently leading in "
                         "the Brindle Quay ward", BQ, tags=["chatty", "exact"])))
add(single(B.candidate_standing("juna tullock how many votes", "c19", focus="mark",
                                tags=["exact"])))
add(single(B.candidate_won("has vesna whitmarren won marrowby", "c31", contest_slot=True,
                           tags=["exact"])))
add(single(B.candidate_margin("how far behind is wynn jessavy", "c22", tags=["exact"])))
add(single(B.candidate_margin("by how much did corin gadrel lose", "c14", won_wording=True,
                              tags=["exact"])))
add(single(B.thanks("thank you so much, that's brilliant", tags=["chatty"])))
add(single(B.greeting("hello there", tags=["chatty"])))

# 57 voice radio producer, ward by ward
add(conversation([
    B.ward_leader("whos leading in land mouth", LM, tags=[V, "mishearing"]),
    B.ward_leader("and brindle key", BQ, tags=[V, "mishearing", "ellipsis", "follow_up"]),
    B.ward_leader("and ash venny south", AS_, tags=[V, "mishearing", "ellipsis", "follow_up"]),
    B.count_progress("how much counted there", AS_, tags=[V, "follow_up", "pronoun"]),
    B.none("whats the turnout there", tags=[V, "follow_up", "pronoun"]),
], tags=[V, "follow_up"]))

# 58 partisan comparisons across wards (not covered) and back
add(conversation([
    B.party_in_ward("how are moorland doing in ashvenny south", "moorland", AS_,
                    extra=("place",), tags=["partial"]),
    B.none("is that better than they did there last time", focus="compare",
           tags=["follow_up", "pronoun"]),
    B.compared("ok is gaspard behind sabeth", "c06", "c05", contest_slot=True,
               tags=["follow_up", "partial"]),
    B.candidate_margin("by how much", "c06", contest_slot=True, tags=["follow_up", "ellipsis"]),
], tags=["follow_up"]))

# 59 voice, a candidate by first name only
add(conversation([
    B.candidate_party("what party is odile", "c03", tags=[V, "partial"]),
    B.candidate_standing("how many votes", "c03", focus="mark", tags=[V, "follow_up", "ellipsis"]),
    B.none("is she going to keep her deposit", focus="whether", tags=[V, "follow_up", "pronoun"]),
], tags=[V, "follow_up"]))

# 60 who is winning in the council race overall
add(conversation([
    B.seat_totals("who's winning the council overall", focus="who", tags=["chatty"]),
    B.open_races("how many wards are left", as_count=True, focus="count", tags=["follow_up"]),
    B.none("when is the last one expected", focus="when", tags=["follow_up"]),
], tags=["follow_up"]))


# 61 voter in Caddenmill, voice, thanks in the middle
add(conversation([
    B.ward_leader("hi im in cadden mil whos winning", CM, tags=[V, "mishearing", "chatty"]),
    B.compared("is corrigane ahead of fennow", "c12", "c13", contest_slot=True,
               tags=[V, "follow_up", "partial"]),
    B.party_in_ward("what about the lantern candidate how many votes", "lantern", CM,
                    tags=[V, "follow_up"]),
    B.thanks("cheers", tags=[V, "thanks_between"]),
    B.party_seats("oh and how many seats have harbour got", "harbour",
                  tags=[V, "new_question", "partial"]),
], tags=[V, "thanks_between", "follow_up"]))

# 62 journalist on shares in Brindle Quay
add(conversation([
    B.ward_leader("what's the margin in brindle quay", BQ, focus="margin", tags=["exact"]),
    B.candidate_standing("what share has oskary got", "c09", extra=("share",),
                         tags=["follow_up", "partial"]),
    B.candidate_standing("and mirrowen", "c10", extra=("share",),
                         tags=["follow_up", "ellipsis", "partial"]),
    B.none("who's the youngest candidate there", focus="who", tags=["follow_up"]),
], tags=["follow_up"]))

# 63 Harbour voter in Lanmouth
add(conversation([
    B.party_in_ward("how's the harbour candidate doing in lanmouth", "harbour", LM,
                    extra=("place",), tags=["partial"]),
    B.compared("is kell ahead of maren", "c28", "c29", contest_slot=True,
               tags=["follow_up", "partial"]),
    B.ward_leader("who's leading there overall", LM, tags=["follow_up", "pronoun"]),
    B.none("would kell win under proportional representation", focus="whether",
           tags=["follow_up", "partial"]),
], tags=["follow_up"]))

# 64 just woke up, thinks it is morning
add(conversation([
    B.open_races("morning!! is it all over", as_count=True, focus="status", tags=["chatty"]),
    B.ward_leader("who's winning in dunvarrick", DV, tags=["follow_up"]),
    B.count_progress("how much counted", DV, tags=["follow_up", "ellipsis"]),
    B.ward_results("anything from wrenlow sands yet", WS, tags=["new_question"]),
], tags=["follow_up"]))


# ---------------------------------------------------------------------------
def turns_of(case):
    return case["conversation"] if "conversation" in case else [case]


def check(cases):
    allowed = {"ask", "intent", "slots", "outcome", "focus", "says", "never", "tags"}
    for case in cases:
        for t in turns_of(case):
            assert set(t) <= allowed, t
            assert "focus" in t, t
        if "conversation" in case:
            assert 2 <= len(case["conversation"]) <= 6, case


def stats(cases):
    turns = [t for c in cases for t in turns_of(c)]
    uncovered = [t for t in turns if t["intent"] == "none" and t["outcome"] == "not_covered"]
    no_data = [t for t in turns if t["outcome"] == "no_data"]
    return len(cases), len(turns), len(uncovered), len(no_data)


def main():
    check(CASES)
    n_cases, n_turns, n_unc, n_nodata = stats(CASES)
    header = (
        "# Blind question set: scenario election, moment 23:45\n"
        "# (replay batches %s applied; clock %s).\n"
        "# Written by tests/eval/blind/round7/label_election_2345.py\n"
        "# (facts computed by label_election_2345_lib.py from dataset-demo/election/).\n"
        "# %d cases, %d turns; %d turns not covered by any intent (%.1f%%), "
        "%d more covered but without data yet.\n"
        % (", ".join(S.applied), CLOCK, n_cases, n_turns, n_unc, 100.0 * n_unc / n_turns,
           n_nodata))
    out = os.path.join(os.path.dirname(os.path.abspath(__file__)), "election-2345.yaml")
    body = yaml.safe_dump(CASES, sort_keys=False, allow_unicode=True, width=100)
    with open(out, "w", encoding="utf-8") as fh:
        fh.write(header + body)
    with open(out, encoding="utf-8") as fh:
        yaml.safe_load(fh)
    print("wrote %s: %d cases, %d turns, %d not covered (%.1f%%), %d no_data"
          % (out, n_cases, n_turns, n_unc, 100.0 * n_unc / n_turns, n_nodata))


if __name__ == "__main__":
    main()
