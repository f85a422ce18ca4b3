"""Blind question set for the election scenario at 23:45 (replay batches 01-05
applied, clock 2027-05-06T23:45+01:00).  Writes election-2345.yaml next to
this script.  Facts come from label_election_common (computed from the data)."""
import os
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from label_election_common import Election, T, C, build, stats, write  # noqa: E402

EL = Election(batches=5)
FINAL = Election(batches=21)  # only used for "never" facts from the wrong moment


def W(c):
    return {"contest": c}


def P(c):
    return {"competitor": c}


def VS(a, b):
    return {"competitor": a, "rival": b}


def PW(g, c):
    return {"group": g, "contest": c}


def PL(c, n):
    return {"contest": c, "place": str(n)}


def G(g):
    return {"group": g}


def final_votes(contest):
    """Vote figures only the final count has (wrong at 23:45)."""
    return [f"{v:,}" for _, _, v in FINAL.standings(contest)]


AN, AS, BQ, CM, DV, FG, GV, LM, MB, PH, QC, WS = (
    "ashvenny-north", "ashvenny-south", "brindle-quay", "caddenmill", "dunvarrick",
    "fennick-green", "gorsevane", "lanmouth", "marrowby", "pellin-heath",
    "quellan-cross", "wrenlow-sands")

ASH = ["Ashvenny North", "Ashvenny South"]
BRANNICK = ["Tamsin Brannick", "Quilla Brannick"]

CASES = [
    # ---------------- ward leaders
    T("who's ahead in Ashvenny North right now?", "ward_leader", W(AN), "who", ["exact", "contraction"],
      extra_never=final_votes(AN)[:1]),
    T("whos leading brindle quay", "ward_leader", W(BQ), "who", ["exact", "contraction"]),
    T("Caddenmill - who's in front?", "ward_leader", W(CM), "who", ["exact"]),
    T("who is top of the count in dunvarick", "ward_leader", W(DV), "who", ["misspelling"]),
    T("leader in Fennick Green?", "ward_leader", W(FG), "who", ["exact"]),
    T("who's leading gorsevane and by how much", "ward_leader", W(GV), "margin", ["exact"]),
    T("lanmouth town, who's out in front at the moment", "ward_leader", W(LM), "who", ["partial"]),
    T("who's leading in marrowby at this stage", "ward_leader", W(MB), "who", ["exact"]),
    T("whos winning on the heath", "ward_leader", W(PH), "who", ["partial"]),
    T("who is leading in quellan cross", "ward_leader", W(QC), "who", ["exact"]),
    T("who's ahead in the sands", "ward_leader", W(WS), "who", ["partial"]),
    T("how big is orla quenlow's lead", "ward_leader", W(AN), "margin", ["exact"]),
    T("by how many votes is ilsa rookhaven ahead?", "ward_leader", W(LM), "margin", ["exact"]),
    T("whats the gap at the top in fennick", "ward_leader", W(FG), "margin", ["partial"]),
    T("hey whos leading in ash venny south", "ward_leader", W(AS), "who", ["voice", "mishearing"],
      extra_never=final_votes(AS)[:1]),
    T("who's on top in pelling heath", "ward_leader", W(PH), "who", ["voice", "mishearing"]),
    # ---------------- ward results
    T("full results for caddenmill", "ward_results", W(CM), "results", ["exact"], extra_never=final_votes(CM)[:2]),
    T("can I see the numbers for dunvarrick please", "ward_results", W(DV), "results", ["exact", "chatty"]),
    T("vote totals gorsevane", "ward_results", W(GV), "results", ["exact"]),
    T("lanmouth results so far pls", "ward_results", W(LM), "results", ["exact"]),
    T("give me the standings in pellin heath", "ward_results", W(PH), "results", ["exact"]),
    T("ashvenny south votes", "ward_results", W(AS), "results", ["exact"]),
    T("what's the count looking like in brindle quay?", "ward_results", W(BQ), "results", ["exact"],
      extra_never=final_votes(BQ)),
    T("results for wrenlow sands", "ward_results", W(WS), "results", ["exact"]),
    T("quellan cross numbers?", "ward_results", W(QC), "results", ["exact"]),
    T("how's everyone doing in fenick green", "ward_results", W(FG), "results", ["misspelling"]),
    # ---------------- ward winners (nothing declared yet)
    T("who won fennick green", "ward_winner", W(FG), "who", ["exact"]),
    T("has brindle quay declared yet", "ward_winner", W(BQ), "status", ["exact"]),
    T("who took the seat in marrowby?", "ward_winner", W(MB), "who", ["exact"]),
    T("winner in gorsevane??", "ward_winner", W(GV), "who", ["exact"]),
    T("who got elected in lanmouth", "ward_winner", W(LM), "who", ["exact"]),
    T("whos the new councillor for dunvarrick", "ward_winner", W(DV), "who", ["exact"]),
    # ---------------- places
    T("who's 3rd in ashvenny north", "ward_place", PL(AN, 3), "who", ["exact"]),
    T("who is second in lanmouth", "ward_place", PL(LM, 2), "who", ["exact", "number_words"]),
    T("who's currently last in fennick green", "ward_place", PL(FG, 4), "who", ["exact"]),
    T("who's sitting in second place in pellin heath", "ward_place", PL(PH, 2), "who", ["exact"]),
    T("third place in marrowby?", "ward_place", PL(MB, 3), "who", ["exact", "number_words"]),
    T("who's 4th in caddenmill right now", "ward_place", PL(CM, 4), "who", ["exact"]),
    T("who's fifth in dunvarrick", "ward_place", PL(DV, 5), "who", ["exact", "number_words"]),
    T("who is runner up in quellan cross", "ward_place", PL(QC, 2), "who", ["exact"]),
    # ---------------- count progress
    T("how much of the vote is counted in ashvenny north", "count_progress", W(AN), "status", ["exact"]),
    T("percentage counted caddenmill?", "count_progress", W(CM), "status", ["exact"]),
    T("how far through the count are they in dunvarrick", "count_progress", W(DV), "status", ["exact"]),
    T("how many of the ballots have been counted in gorsevane", "count_progress", W(GV), "status", ["exact"]),
    T("is the pellin heath count nearly done", "count_progress", W(PH), "status", ["exact"]),
    T("has counting begun in wrenlow sands", "count_progress", W(WS), "status", ["exact"]),
    T("whats the count progress at marrowby", "count_progress", W(MB), "status", ["exact"]),
    T("how much is in from lanmouth", "count_progress", W(LM), "status", ["exact"]),
    T("how much of brindle key is counted", "count_progress", W(BQ), "status", ["voice", "mishearing"]),
    # ---------------- candidate party
    T("What party is Orla Quenlow?", "candidate_party", P("c01"), "group_of", ["exact"]),
    T("which party does Ivo Oskary represent", "candidate_party", P("c09"), "group_of", ["exact"]),
    T("nevin corrigane - what party", "candidate_party", P("c12"), "group_of", ["exact"]),
    T("is fenwick savrelle harbour alliance?", "candidate_party", P("c18"), "group_of", ["exact"]),
    T("who is pim wystrel standing for", "candidate_party", P("c20"), "group_of", ["exact"]),
    T("aldo orrick party", "candidate_party", P("c23"), "group_of", ["exact"]),
    T("which ward is kesia carravine standing in", "candidate_party", P("c36"), "where", ["exact"]),
    T("Caelan Dunstreth is with which party?", "candidate_party", P("c37"), "group_of", ["exact"]),
    T("what party is yara glenvane from", "candidate_party", P("c40"), "group_of", ["exact"]),
    T("tove inglemarsh, which side is she on", "candidate_party", P("c42"), "group_of", ["exact"]),
    T("who does madoc quaddle stand for", "candidate_party", P("c25"), "group_of", ["exact"]),
    T("hesper ambrell party affiliation?", "candidate_party", P("c15"), "group_of", ["exact"]),
    T("what party's mirela stellick", "candidate_party", P("c27"), "group_of", ["contraction"]),
    T("whats ulric fennows party", "candidate_party", P("c13"), "group_of", ["exact"]),
    T("perrin farrowgate party pls", "candidate_party", P("c39"), "group_of", ["exact"]),
    T("which party is bastian elsmyre", "candidate_party", P("c38"), "group_of", ["misspelling"]),
    T("joram hestermore what party", "candidate_party", P("c41"), "group_of", ["misspelling"]),
    T("elric ivenhall, alliance or progressives?", "candidate_party", P("c21"), "group_of", ["exact"]),
    T("Wynn Jessavy: party?", "candidate_party", P("c22"), "group_of", ["exact"]),
    T("talia yarrowby's party", "candidate_party", P("c32"), "group_of", ["exact"]),
    T("what party is sten luskeith", "candidate_party", P("c16"), "group_of", ["voice", "mishearing"]),
    T("where's oswin pembrev standing", "candidate_party", P("c24"), "where", ["exact", "contraction"]),
    T("Quenlow - which ward?", "candidate_party", P("c01"), "where", ["partial"]),
    # ---------------- compared
    T("Is Nevin Corrigane ahead of Ulric Fennow?", "candidates_compared", VS("c12", "c13"), "whether", ["exact"]),
    T("pim wystrel or juna tullock, who's ahead", "candidates_compared", VS("c20", "c19"), "compare", ["exact"]),
    T("is aldo orrick beating oswin pembrev", "candidates_compared", VS("c23", "c24"), "whether", ["exact"]),
    T("rookhaven v stellick", "candidates_compared", VS("c26", "c27"), "compare", ["partial"]),
    T("who's ahead between ameline rennow and fenwick savrelle", "candidates_compared", VS("c17", "c18"), "compare", ["exact"]),
    T("is vesna whitmarren ahead of talia yarrowby at the minute", "candidates_compared", VS("c31", "c32"), "whether", ["exact"]),
    T("is caelan dunstreth ahead of kesia carravine", "candidates_compared", VS("c37", "c36"), "whether", ["exact"]),
    T("fianna zellick vs quilla brannick", "candidates_compared", VS("c33", "c35"), "compare", ["exact"]),
    T("sabeth pellagan still in front of torvane?", "candidates_compared", VS("c05", "c06"), "whether", ["partial"]),
    # ---------------- candidate result (nothing declared yet)
    T("has ivo oskary won", "candidate_result", P("c09"), "whether", ["exact"]),
    T("did nevin corrigane win his seat", "candidate_result", P("c12"), "whether", ["exact"]),
    T("is yara glenvane elected?", "candidate_result", P("c40"), "whether", ["exact"]),
    T("has orla quen low been elected", "candidate_result", P("c01"), "whether", ["voice", "mishearing"]),
    # ---------------- party in ward
    T("how are harbour doing in caddenmill", "party_in_ward", PW("harbour", CM), "how_did", ["partial"]),
    T("how's the lantern party getting on in brindle quay", "party_in_ward", PW("lantern", BQ), "how_did", ["exact"]),
    T("moorland in marrowby?", "party_in_ward", PW("moorland", MB), "how_did", ["partial"]),
    T("how are the greens faring in ashvenny north", "party_in_ward", PW("greens", AN), "how_did", ["partial"]),
    T("how many votes have the progressives got in dunvarrick", "party_in_ward", PW("moorland", DV), "mark", ["partial"]),
    T("how's tollgate doing in ashvenny south", "party_in_ward", PW("tollgate", AS), "how_did", ["partial"]),
    T("how are the alliance doing in pellin heath", "party_in_ward", PW("harbour", PH), "how_did", ["partial"]),
    T("the lanterns in fennick green, how are they doing", "party_in_ward", PW("lantern", FG), "how_did", ["partial"]),
    T("how's harbour doing in wrenlow sands", "party_in_ward", PW("harbour", WS), "how_did", ["partial"]),
    T("how are the civic greens doing in gorsevane", "party_in_ward", PW("greens", GV), "how_did", ["exact"]),
    T("mpr in lanmouth how many votes", "party_in_ward", PW("moorland", LM), "mark", ["abbreviation"]),
    # ---------------- seats
    T("how many seats have the lanterns won", "party_seats", G("lantern"), "count", ["partial"]),
    T("moorland seats so far?", "party_seats", G("moorland"), "count", ["partial"]),
    T("has tollgate won anything yet", "party_seats", G("tollgate"), "count", ["partial"]),
    T("seat totals please", "seat_totals", {}, "table", ["exact"]),
    T("show me the seats table", "seat_totals", {}, "table", ["exact"]),
    # ---------------- open races
    T("which wards are still counting", "open_races", {}, "open", ["exact"]),
    T("whats still to declare", "open_races", {}, "open", ["exact"]),
    T("are any wards declared yet?", "open_races", {}, "open", ["exact"]),
    # ---------------- chat
    T("good evening", "greeting", {}, "chat", []),
    T("what sort of things can i ask you", "help", {}, "chat", []),
    T("help", "help", {}, "chat", []),
    # ---------------- ambiguous singles
    T("whos ahead in ashvenny", "ward_leader", {}, "who", ["ambiguous", "partial"], clarify=ASH),
    T("brannick's party?", "candidate_party", {}, "group_of", ["ambiguous", "partial"], clarify=BRANNICK),
    T("how much has been counted so far?", "count_progress", {}, "status", ["missing_slot"], clarify=[]),
    # ---------------- not covered / off beat
    T("how old is Orla Quenlow", "none", focus="other", tags=["exact"]),
    T("what was the turnout in caddenmill", "none", focus="other", tags=["exact"]),
    T("who won Ashvenny North last time, in 2022?", "none", focus="who", tags=["exact"],
      never=[EL.name(EL.standings(AN)[0][1])]),
    T("what are the latest polls saying", "none", focus="other", tags=[]),
    T("how much did the harbour alliance spend on their campaign", "none", focus="other", tags=[]),
    T("where is the brindle quay count taking place", "none", focus="where", tags=[]),
    T("which venue is counting marrowby", "none", focus="where", tags=[]),
    T("how big is the electorate in tamsendale", "none", focus="other", tags=[]),
    T("any spoilt ballots in lanmouth?", "none", focus="other", tags=[]),
    T("what's the swing from moorland to harbour", "none", focus="other", tags=["contraction"]),
    T("who's going to run the council after tonight", "none", focus="other", tags=["contraction"]),
    T("does any party have a majority", "none", focus="other", tags=[]),
    T("how many votes has harbour got across the whole county", "none", focus="mark", tags=[]),
    T("which is the closest race tonight", "none", focus="other", tags=[]),
    T("who leads the lantern party", "none", focus="other", tags=[]),
    T("whats the weather like in tamsendale tomorrow", "none", focus="other", tags=["relative_day"],
      outcome="not_understood"),
    T("asdkjh qwe zzz", "none", focus="other", tags=[], outcome="not_understood"),
    T("what does tollgate actually stand for, policy wise", "none", focus="other", tags=[]),
    T("is gaspard torvane the sitting councillor", "none", focus="other", tags=[]),
    T("when do they expect the wrenlow sands result", "none", focus="when", tags=[]),
    T("which candidate has the most votes anywhere so far", "none", focus="who", tags=[]),
    T("what time did caddenmill start counting", "none", focus="when", tags=[]),
    T("how many women are standing for the council", "none", focus="count", tags=[]),
    T("was there an exit poll", "none", focus="other", tags=[]),
    T("who's leading the postal vote in lanmouth", "none", focus="who", tags=["constraint"],
      never=["Ilsa Rookhaven"]),
    T("leaving the lanterns out, who's top in brindle quay", "none", focus="who", tags=["constraint"],
      never=["Ivo Oskary"]),
    T("tell me a joke", "none", focus="other", tags=[], outcome="not_understood"),
    T("what's ivo oskary's day job", "none", focus="other", tags=[]),

    # ================= conversations
    C(T("who's ahead in brindle quay", "ward_leader", W(BQ), "who", ["exact"]),
      T("and how much has been counted there", "count_progress", W(BQ), "status", ["follow_up", "ellipsis"]),
      T("thanks!", "thanks", {}, "chat", []),
      tags=["follow_up"]),
    C(T("hi there", "greeting", {}, "chat", []),
      T("whats the score in caddenmill", "ward_results", W(CM), "results", ["exact"]),
      T("is corrigane ahead of fennow", "candidates_compared", VS("c12", "c13"), "whether", ["partial", "follow_up"]),
      T("and who's third", "ward_place", PL(CM, 3), "who", ["follow_up", "ellipsis"]),
      tags=["follow_up"]),
    C(T("which party is Tamsin Brannick", "candidate_party", P("c07"), "group_of", ["exact"]),
      T("is she ahead of rhosyn dretholm", "candidates_compared", VS("c07", "c08"), "whether", ["pronoun", "follow_up"]),
      tags=["pronoun"]),
    C(T("who's winning", "ward_leader", {}, "who", ["missing_slot"], clarify=[]),
      T("gorsevane", "ward_leader", W(GV), "who", ["follow_up", "ellipsis"]),
      T("how close is it between the top two", "ward_leader", W(GV), "margin", ["follow_up"]),
      tags=["clarify", "missing_slot"]),
    C(T("how far along is the ashvenny count", "count_progress", {}, "status", ["ambiguous", "partial"], clarify=ASH),
      T("south", "count_progress", W(AS), "status", ["follow_up", "ellipsis"]),
      T("and north?", "count_progress", W(AN), "status", ["follow_up", "ellipsis"]),
      tags=["clarify", "ambiguous"]),
    C(T("what party is brannick", "candidate_party", {}, "group_of", ["ambiguous", "partial"], clarify=BRANNICK),
      T("the one in pellin heath", "candidate_party", P("c35"), "group_of", ["follow_up"]),
      T("how old is she", "none", focus="other", tags=["pronoun", "follow_up"]),
      tags=["clarify", "ambiguous"]),
    C(T("what was turnout like in lanmouth", "none", focus="other", tags=[]),
      T("ok then who's leading there", "ward_leader", W(LM), "who", ["follow_up", "pronoun"]),
      T("and second?", "ward_place", PL(LM, 2), "who", ["follow_up", "ellipsis"]),
      tags=["follow_up"]),
    C(T("has quellan cross started counting", "count_progress", W(QC), "status", ["exact"]),
      T("who's ahead there then", "ward_leader", W(QC), "who", ["follow_up", "pronoun"]),
      T("where's the count for it", "none", focus="where", tags=["follow_up", "pronoun"]),
      tags=["follow_up"]),
    C(T("which races are still undecided", "open_races", {}, "open", []),
      T("how many seats has harbour got so far", "party_seats", G("harbour"), "count", ["partial", "new_question"]),
      T("thanks that's all", "thanks", {}, "chat", []),
      tags=["new_question"]),
    C(T("has orla quenlow won yet", "candidate_result", P("c01"), "whether", ["exact"]),
      T("who's ahead in her ward then", "ward_leader", W(AN), "who", ["pronoun", "follow_up"]),
      tags=["pronoun"]),
    C(T("how are the greens doing in fennick green", "party_in_ward", PW("greens", FG), "how_did", ["partial"]),
      T("and in lanmouth", "party_in_ward", PW("greens", LM), "how_did", ["follow_up", "ellipsis"]),
      T("what about the lanterns there", "party_in_ward", PW("lantern", LM), "how_did", ["follow_up", "pronoun"]),
      tags=["follow_up", "ellipsis"]),
    C(T("full results marrowby please", "ward_results", W(MB), "results", []),
      T("that's barely anything counted right? how much", "count_progress", W(MB), "status", ["follow_up", "contraction"]),
      T("cheers", "thanks", {}, "chat", []),
      tags=["follow_up"]),
    C(T("who's in front in dunvarrick", "ward_leader", W(DV), "who", []),
      T("is sten lusketh with tollgate?", "candidate_party", P("c16"), "group_of", ["follow_up"]),
      T("did he stand last time too", "none", focus="other", tags=["pronoun", "follow_up"]),
      tags=["follow_up", "pronoun"]),
    C(T("how is moorland doing in gorsevane", "party_in_ward", PW("moorland", GV), "how_did", ["partial"]),
      T("and tollgate", "party_in_ward", PW("tollgate", GV), "how_did", ["follow_up", "ellipsis"]),
      T("so who's top", "ward_leader", W(GV), "who", ["follow_up", "ellipsis"]),
      tags=["follow_up", "ellipsis"]),
    C(T("whos leading in pellin heath", "ward_leader", W(PH), "who", []),
      T("what about wrenlow sands", "ward_leader", W(WS), "who", ["follow_up", "ellipsis"]),
      T("when does that one start counting", "none", focus="when", tags=["follow_up", "pronoun"]),
      tags=["follow_up"]),
    C(T("hello", "greeting", {}, "chat", []),
      T("what can you do", "help", {}, "chat", []),
      T("ok who won ashvenny north", "ward_winner", W(AN), "who", []),
      T("who's ahead then", "ward_leader", W(AN), "who", ["follow_up", "ellipsis"]),
      tags=["follow_up"]),
    C(T("nessa mirrowen what party", "candidate_party", P("c10"), "group_of", []),
      T("is she ahead of ivo oskary", "candidates_compared", VS("c10", "c09"), "whether", ["pronoun", "follow_up"]),
      T("and is she ahead of brisa halvesk", "candidates_compared", VS("c10", "c11"), "whether", ["pronoun", "follow_up"]),
      tags=["pronoun"]),
    C(T("what percentage of fennick green is in", "count_progress", W(FG), "status", []),
      T("who's leading", "ward_leader", W(FG), "who", ["follow_up", "ellipsis"]),
      T("how about third place", "ward_place", PL(FG, 3), "who", ["follow_up", "ellipsis"]),
      tags=["follow_up"]),
    C(T("is delphy vardisse beating odile yellmer", "candidates_compared", VS("c02", "c03"), "whether", []),
      T("which party is kestrove with", "candidate_party", P("c04"), "group_of", ["partial", "new_question"]),
      tags=["new_question"]),
    C(T("who's 2nd in ashvenny south", "ward_place", PL(AS, 2), "who", []),
      T("what party is he", "candidate_party", P("c06"), "group_of", ["pronoun", "follow_up"]),
      T("how much did moorland spend on the campaign there", "none", focus="other", tags=["follow_up"]),
      tags=["pronoun"]),
    C(T("juna tullock party?", "candidate_party", P("c19"), "group_of", []),
      T("is she leading her ward", "ward_leader", W(FG), "whether", ["pronoun", "follow_up"]),
      tags=["pronoun"]),
    C(T("who is leading in lan mouth", "ward_leader", W(LM), "who", ["voice"]),
      T("how much is counted", "count_progress", W(LM), "status", ["voice", "follow_up", "ellipsis"]),
      T("thank you", "thanks", {}, "chat", ["voice"]),
      T("what about brindle key", "count_progress", W(BQ), "status", ["voice", "mishearing", "follow_up", "ellipsis"]),
      tags=["voice", "thanks_between"]),
    C(T("whats the seat count so far", "seat_totals", {}, "table", []),
      T("which wards are left to declare", "open_races", {}, "open", ["new_question"]),
      T("and which of them haven't even started counting", "none", focus="open", tags=["constraint", "follow_up"],
        never=["Caddenmill", "Brindle Quay"]),
      tags=["follow_up"]),
    C(T("ivo oskary vs nessa mirrowen who's up", "candidates_compared", VS("c09", "c10"), "compare", []),
      T("and how far ahead is ivo", "ward_leader", W(BQ), "margin", ["partial", "follow_up"]),
      T("what about the third candidate there", "ward_place", PL(BQ, 3), "who", ["follow_up"]),
      tags=["follow_up"]),
    C(T("who has the most votes in the county so far", "none", focus="who", tags=[]),
      T("ok, who's leading in marrowby then", "ward_leader", W(MB), "who", ["new_question"]),
      tags=["new_question"]),
    C(T("are the polls any good this year", "none", focus="other", tags=[]),
      T("what did the last poll say for harbour", "none", focus="other", tags=["follow_up"]),
      T("ok forget it, how many seats for harbour", "party_seats", G("harbour"), "count", ["new_question"]),
      tags=["new_question"]),
    C(T("whos leading in kadden mill", "ward_leader", W(CM), "who", ["voice", "mishearing"]),
      T("is it close", "ward_leader", W(CM), "margin", ["voice", "follow_up", "pronoun"]),
      T("whos last", "ward_place", PL(CM, 4), "who", ["voice", "follow_up", "ellipsis"]),
      tags=["voice"]),
    C(T("rosmund vossery what party", "candidate_party", P("c30"), "group_of", []),
      T("where are they standing", "candidate_party", P("c30"), "where", ["pronoun", "follow_up"]),
      T("how much counted there", "count_progress", W(MB), "status", ["follow_up", "pronoun"]),
      tags=["pronoun"]),
    C(T("lowen abernell is a green right", "candidate_party", P("c34"), "group_of", []),
      T("is lowen ahead of quilla brannick", "candidates_compared", VS("c34", "c35"), "whether", ["follow_up", "partial"]),
      T("ta", "thanks", {}, "chat", []),
      T("who's top in pellin heath overall", "ward_leader", W(PH), "who", ["follow_up"]),
      tags=["thanks_between"]),
    C(T("how did tollgate do in dunvarrick so far", "party_in_ward", PW("tollgate", DV), "how_did", ["partial"]),
      T("who are they up against", "ward_results", W(DV), "results", ["pronoun", "follow_up"]),
      tags=["pronoun"]),
    C(T("gaspard torvane or sabeth pellagan, who's ahead", "candidates_compared", VS("c06", "c05"), "compare", []),
      T("how much of ashvenny south has been counted", "count_progress", W(AS), "status", ["follow_up"]),
      T("and when will we know", "none", focus="when", tags=["follow_up"]),
      tags=["follow_up"]),
    C(T("who's ahead in wren low sands", "ward_leader", W(WS), "who", ["voice", "mishearing"]),
      T("what party is yarra glen vane", "candidate_party", P("c40"), "group_of", ["voice", "mishearing"]),
      T("and jorum hester moor", "candidate_party", P("c41"), "group_of", ["voice", "mishearing", "ellipsis"]),
      tags=["voice"]),
    C(T("evening! quick one, who's leading in caddenmill", "ward_leader", W(CM), "who", ["chatty"]),
      T("which party is that", "candidate_party", P("c12"), "group_of", ["pronoun", "follow_up"]),
      T("and the person in second?", "ward_place", PL(CM, 2), "who", ["follow_up", "ellipsis"]),
      T("what party is the runner up from", "candidate_party", P("c13"), "group_of", ["follow_up"]),
      tags=["chatty", "follow_up"]),
    C(T("hows harbour doing in ashvenny north", "party_in_ward", PW("harbour", AN), "how_did", ["partial"]),
      T("and moorland there", "party_in_ward", PW("moorland", AN), "how_did", ["follow_up", "ellipsis"]),
      T("what about ashvenny south for moorland", "party_in_ward", PW("moorland", AS), "how_did", ["follow_up"]),
      tags=["follow_up"]),
    C(T("whats ilsa rookhaven's party", "candidate_party", P("c26"), "group_of", []),
      T("has she won", "candidate_result", P("c26"), "whether", ["pronoun", "follow_up"]),
      T("how many people voted for her last time", "none", focus="other", tags=["pronoun", "follow_up"]),
      tags=["pronoun"]),
]


def main():
    cases = build(EL, CASES)
    header = ("# Blind question set, round 4: scenario election, moment 23:45\n"
              "# (replay batches 01-05 applied, clock 2027-05-06T23:45+01:00).\n"
              "# Written by tests/eval/blind/round4/label_election_2345.py"
              " (facts computed from dataset-demo/election/).\n")
    out = os.path.join(os.path.dirname(os.path.abspath(__file__)), "election-2345.yaml")
    write(out, header, cases)
    print(stats(cases))


if __name__ == "__main__":
    main()
