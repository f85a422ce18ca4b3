"""Blind question set for the election scenario at 03:45 (every replay batch
applied, clock 2027-05-07T03:45+01:00).  Writes election-0345.yaml next to
this script.  Facts come from label_election_common (computed from the data)."""
import os
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from label_election_common import Election, T, C, build, stats, write  # noqa: E402

EL = Election(batches=21)
EARLY = Election(batches=5)  # only used for "never" facts from the wrong moment (23:45)


def W(c):
    return {"contest": c}


def P(c, contest=None):
    d = {"competitor": c}
    if contest:
        d["contest"] = contest
    return d


def VS(a, b):
    return {"competitor": a, "rival": b}


def PW(g, c):
    return {"group": g, "contest": c}


def PL(c, n):
    return {"contest": c, "place": str(n)}


def G(g):
    return {"group": g}


def stale_votes(contest):
    """Vote figures from 23:45 that differ from every final figure (wrong now)."""
    final = {f"{v:,}" for _, _, v in EL.standings(contest)}
    return [f"{v:,}" for _, _, v in EARLY.standings(contest) if f"{v:,}" not in final][:2]


def stale_lead(contest):
    st = EARLY.standings(contest)
    if not st:
        return []
    m = f"{st[0][2] - st[1][2]:,}"
    fs = EL.standings(contest)
    return [] if m == f"{fs[0][2] - fs[1][2]:,}" else [m]


AN, AS, BQ, CM, DV, FG, GV, LM, MB, PH, QC, WS = (
    "ashvenny-north", "ashvenny-south", "brindle-quay", "caddenmill", "dunvarrick",
    "fennick-green", "gorsevane", "lanmouth", "marrowby", "pellin-heath",
    "quellan-cross", "wrenlow-sands")

ASH = ["Ashvenny North", "Ashvenny South"]
BRANNICK = ["Tamsin Brannick", "Quilla Brannick"]

CASES = [
    # ---------------- winners
    T("who won ashvenny north?", "ward_winner", W(AN), "who", ["exact"], extra_never=stale_votes(AN)),
    T("Ashvenny South winner", "ward_winner", W(AS), "who", ["exact"], extra_never=stale_votes(AS)),
    T("who's the councillor for caddenmill now", "ward_winner", W(CM), "who", ["contraction"]),
    T("dunvarrick result - who won it", "ward_winner", W(DV), "who", ["exact"]),
    T("who took fennick green in the end", "ward_winner", W(FG), "who", ["exact"]),
    T("gorsevane, who got in?", "ward_winner", W(GV), "who", ["exact"]),
    T("who won the seat in lanmouth town", "ward_winner", W(LM), "who", ["partial"]),
    T("Marrowby winner?", "ward_winner", W(MB), "who", ["exact"]),
    T("who won pellin", "ward_winner", W(PH), "who", ["partial"]),
    T("so who won quellan cross after all that", "ward_winner", W(QC), "who", ["chatty"]),
    T("who was elected in wrenlow", "ward_winner", W(WS), "who", ["partial"]),
    T("who one fennic green", "ward_winner", W(FG), "who", ["voice", "mishearing"]),
    T("kwellan cross who won", "ward_winner", W(QC), "who", ["voice", "mishearing"]),
    T("Who won Brindle Quay? Sorry if you've been asked a hundred times", "ward_winner", W(BQ), "who", ["chatty"]),
    T("did anyone win in gorsvane yet", "ward_winner", W(GV), "whether", ["misspelling"]),
    # ---------------- margins
    T("by how much did orla quenlow win", "candidate_margin", P("c01"), "margin", ["exact"], extra_never=stale_lead(AN)),
    T("how many votes did gaspard torvane win by", "candidate_margin", P("c06"), "margin", ["exact"]),
    T("what was ivo oskary's majority", "candidate_margin", P("c09"), "margin", ["exact"]),
    T("how narrowly did ulric fennow lose", "candidate_margin", P("c13"), "margin", ["exact"]),
    T("how far behind was ameline rennow", "candidate_margin", P("c17"), "margin", ["exact"]),
    T("who beat pim wystrel and by how much", "candidate_margin", P("c20"), "margin", ["exact"]),
    T("by what margin did aldo orrick beat pembrev", "candidate_margin", P("c23"), "margin", ["exact"]),
    T("ilsa rookhaven's winning margin?", "candidate_margin", P("c26"), "margin", ["exact"]),
    T("how much did vesna whitmarren lose by", "candidate_margin", P("c31"), "margin", ["exact"]),
    T("fianna zellick won by how many", "candidate_margin", P("c33"), "margin", ["exact"]),
    T("how close did caelan dunstreth come", "candidate_margin", P("c37"), "margin", ["exact"]),
    T("who beat tove inglemarsh", "candidate_margin", P("c42"), "who", ["exact"]),
    T("how many votes short was madoc quaddle", "candidate_margin", P("c25"), "margin", ["exact"]),
    T("what was kesia carravines margin", "candidate_margin", P("c36"), "margin", ["exact"]),
    T("by how many votes did juna tullock take fennick green", "candidate_margin", P("c19", FG), "margin", ["exact"]),
    T("how much did sabeth pelagan lose by", "candidate_margin", P("c05"), "margin", ["voice", "mishearing"]),
    T("who knocked out odile yellmer", "candidate_margin", P("c03"), "who", ["exact"]),
    # ---------------- results
    T("full result ashvenny north", "ward_results", W(AN), "results", ["exact"]),
    T("final numbers gorsevane", "ward_results", W(GV), "results", ["exact"], extra_never=stale_votes(GV)),
    T("fennick green result in full please", "ward_results", W(FG), "results", ["exact"]),
    T("pellin heath final tally", "ward_results", W(PH), "results", ["exact"]),
    T("how did everyone do in quellan cross", "ward_results", W(QC), "results", ["exact"]),
    T("the quay - full results", "ward_results", W(BQ), "results", ["partial"]),
    T("votes in lanmouth?", "ward_results", W(LM), "results", ["exact"]),
    T("results marrowby", "ward_results", W(MB), "results", ["exact"]),
    T("can u give me the whole dunvarrick count", "ward_results", W(DV), "results", ["abbreviation"]),
    T("what were the numbers in ash venny south", "ward_results", W(AS), "results", ["voice", "mishearing"]),
    # ---------------- places
    T("who came second in ashvenny south", "ward_place", PL(AS, 2), "who", ["exact"]),
    T("who was third in gorsevane", "ward_place", PL(GV, 3), "who", ["exact"]),
    T("last place in fennick green?", "ward_place", PL(FG, 4), "who", ["exact"]),
    T("who finished fourth in quellan cross", "ward_place", PL(QC, 4), "who", ["exact", "number_words"]),
    T("runner-up in wrenlow sands?", "ward_place", PL(WS, 2), "who", ["exact"]),
    T("who came 2nd in dunvarrick", "ward_place", PL(DV, 2), "who", ["exact"]),
    T("2nd place pellin heath", "ward_place", PL(PH, 2), "who", ["exact"]),
    T("who came fourth in marrowby", "ward_place", PL(MB, 4), "who", ["exact", "number_words"]),
    T("who came in third in lanmouth", "ward_place", PL(LM, 3), "who", ["exact"]),
    # ---------------- count progress
    T("how much of ashvenny north got counted", "count_progress", W(AN), "status", ["exact"]),
    T("was brindle quay fully counted", "count_progress", W(BQ), "status", ["exact"]),
    T("percentage counted in dunvarrick?", "count_progress", W(DV), "status", ["exact"]),
    T("was all of marrowby counted before they declared", "count_progress", W(MB), "status", ["exact"]),
    T("lanmouth how much counted", "count_progress", W(LM), "status", ["exact"]),
    T("count progress wrenlow sands", "count_progress", W(WS), "status", ["exact"]),
    T("is caddenmill 100% counted now", "count_progress", W(CM), "status", ["exact"]),
    T("hows the count going in the heath", "count_progress", W(PH), "status", ["partial"]),
    # ---------------- candidate party
    T("what party is delphy vardisse", "candidate_party", P("c02"), "group_of", ["exact"]),
    T("odile yellmer party?", "candidate_party", P("c03"), "group_of", ["exact"]),
    T("varian kestrove's party", "candidate_party", P("c04"), "group_of", ["exact"]),
    T("which party is sabeth pellagan in", "candidate_party", P("c05"), "group_of", ["exact"]),
    T("rhosyn dretholm, who's she standing for", "candidate_party", P("c08"), "group_of", ["exact"]),
    T("what party does brisa halvesk belong to", "candidate_party", P("c11"), "group_of", ["exact"]),
    T("corin gadrel what party", "candidate_party", P("c14"), "group_of", ["exact"]),
    T("is ameline rennow moorland", "candidate_party", P("c17"), "group_of", ["exact"]),
    T("kell thrane, which party", "candidate_party", P("c28"), "group_of", ["exact"]),
    T("maren umbersleys party", "candidate_party", P("c29"), "group_of", ["exact"]),
    T("which lot is vesna whitmarren with", "candidate_party", P("c31"), "group_of", ["chatty"]),
    T("quilla brannick party?", "candidate_party", P("c35"), "group_of", ["exact"]),
    T("where was nevin corrigane standing", "candidate_party", P("c12"), "where", ["exact"]),
    T("which ward was tove inglemarsh in", "candidate_party", P("c42"), "where", ["exact"]),
    T("what party's fiana zelick", "candidate_party", P("c33"), "group_of", ["misspelling", "contraction"]),
    T("gaspar torvain party", "candidate_party", P("c06"), "group_of", ["voice", "mishearing"]),
    T("which party is bastien elsmyre and where was he up", "candidate_party", P("c38"), "group_of", ["exact"]),
    T("who's madock quadle with", "candidate_party", P("c25"), "group_of", ["misspelling"]),
    T("party of ulric fennow?", "candidate_party", P("c13"), "group_of", ["exact"]),
    T("kell thrane - remind me which ward he was standing in, and for who?", "candidate_party",
      P("c28"), "where", ["chatty"]),
    # ---------------- compared
    T("did orla quenlow finish ahead of delphy vardisse", "candidates_compared", VS("c01", "c02"), "whether", ["exact"]),
    T("tamsin brannick or rhosyn dretholm, who did better", "candidates_compared", VS("c07", "c08"), "compare", ["exact"]),
    T("ivo oskary v brisa halvesk", "candidates_compared", VS("c09", "c11"), "compare", ["exact"]),
    T("was hesper ambrell ahead of corin gadrel", "candidates_compared", VS("c15", "c14"), "whether", ["exact"]),
    T("did sten lusketh beat fenwick savrelle", "candidates_compared", VS("c16", "c18"), "whether", ["exact"]),
    T("wynn jessavy or elric ivenhall who got more votes", "candidates_compared", VS("c22", "c21"), "compare", ["exact"]),
    T("kell thrane vs maren umbersley", "candidates_compared", VS("c28", "c29"), "compare", ["exact"]),
    T("did perrin farrowgate finish above bastien elsmyre", "candidates_compared", VS("c39", "c38"), "whether", ["exact"]),
    T("yara glenvane or tove inglemarsh, who came out on top", "candidates_compared", VS("c40", "c42"), "compare", ["exact"]),
    T("was madoc quaddle ahead of oswin pembrev", "candidates_compared", VS("c25", "c24"), "whether", ["exact"]),
    T("who did better pellagan or torvane", "candidates_compared", VS("c05", "c06"), "compare", ["partial"]),
    # ---------------- candidate result
    T("did orla quenlow win", "candidate_result", P("c01"), "whether", ["exact"]),
    T("did sabeth pellagan win ashvenny south", "candidate_result", P("c05", AS), "whether", ["exact"]),
    T("did nessa mirrowen get elected", "candidate_result", P("c10"), "whether", ["exact"]),
    T("is nevin corrigane a councillor now?", "candidate_result", P("c12"), "whether", ["exact"]),
    T("did pim wystrel win", "candidate_result", P("c20"), "whether", ["exact"]),
    T("aldo orrick - elected?", "candidate_result", P("c23"), "whether", ["exact"]),
    T("did mirela stellick win lanmouth", "candidate_result", P("c27", LM), "whether", ["exact"]),
    T("was rosmund vossery elected", "candidate_result", P("c30"), "whether", ["exact"]),
    T("did lowen abernell make it", "candidate_result", P("c34"), "whether", ["exact"]),
    T("did caelan dunstreth get in", "candidate_result", P("c37"), "whether", ["exact"]),
    T("did yarra glenvane win", "candidate_result", P("c40"), "whether", ["voice", "mishearing"]),
    T("how did hesper ambrell get on", "candidate_result", P("c15"), "how_did", ["exact"]),
    T("did joram win", "candidate_result", P("c41"), "whether", ["partial"]),
    # ---------------- party in ward
    T("how did moorland do in caddenmill", "party_in_ward", PW("moorland", CM), "how_did", ["partial"]),
    T("harbour alliance result in gorsevane", "party_in_ward", PW("harbour", GV), "how_did", ["exact"]),
    T("how did the greens get on in pellin heath", "party_in_ward", PW("greens", PH), "how_did", ["partial"]),
    T("lanterns in quellan cross?", "party_in_ward", PW("lantern", QC), "how_did", ["partial"]),
    T("independents in gorsevane how many votes", "party_in_ward", PW("tollgate", GV), "mark", ["partial"]),
    T("HAL in fennick green", "party_in_ward", PW("harbour", FG), "how_did", ["abbreviation"]),
    T("how did the progressives do in wrenlow sands", "party_in_ward", PW("moorland", WS), "how_did", ["partial"]),
    T("lantern party in dunvarrick", "party_in_ward", PW("lantern", DV), "how_did", ["exact"]),
    T("did the green candidate in ashvenny south do any good", "party_in_ward", PW("greens", AS), "how_did", ["partial"]),
    T("how many votes did harbour get in brindle quay", "party_in_ward", PW("harbour", BQ), "mark", ["partial"]),
    # ---------------- seats
    T("how many seats did harbour win", "party_seats", G("harbour"), "count", ["partial"]),
    T("how many seats for the greens", "party_seats", G("greens"), "count", ["partial"]),
    T("moorland progressives seat count", "party_seats", G("moorland"), "count", ["exact"]),
    T("has tollgate won a seat?", "party_seats", G("tollgate"), "count", ["partial"]),
    T("how many councillors did the lantern party get", "party_seats", G("lantern"), "count", ["exact"]),
    T("seat totals", "seat_totals", {}, "table", ["exact"]),
    T("give me the final state of the parties", "seat_totals", {}, "table", []),
    T("top two parties by seats", "seat_totals", {"count": "2"}, "table", ["number_words"]),
    T("how many seats has every party got", "seat_totals", {}, "table", []),
    # ---------------- open races
    T("are there any wards still to declare", "open_races", {}, "open", []),
    T("anything still outstanding?", "open_races", {}, "open", []),
    T("is the count over everywhere", "open_races", {}, "open", []),
    # ---------------- chat
    T("hey", "greeting", {}, "chat", []),
    T("thanks so much", "thanks", {}, "chat", []),
    T("what do you do exactly", "help", {}, "chat", []),
    # ---------------- ambiguous / missing
    T("brannick margin", "candidate_margin", {}, "margin", ["ambiguous", "partial"], clarify=BRANNICK),
    T("ashvenny result", "ward_results", {}, "results", ["ambiguous", "partial"], clarify=ASH),
    T("so what party is she in", "candidate_party", {}, "group_of", ["missing_slot", "pronoun"], clarify=[]),
    T("who came third in ashvenny", "ward_place", {"place": "3"}, "who", ["ambiguous", "partial"], clarify=ASH),
    # ---------------- not covered / off beat
    T("who won the most votes overall", "none", focus="who", tags=[]),
    T("what was the overall turnout", "none", focus="other", tags=[]),
    T("how many registered voters are there in gorsevane", "none", focus="count", tags=[]),
    T("how does this compare with 2022", "none", focus="other", tags=[]),
    T("did moorland gain any seats", "none", focus="other", tags=[]),
    T("how many seats did harbour lose compared to last time", "none", focus="count", tags=[],
      never=["three"]),
    T("were the polls right in the end", "none", focus="other", tags=[]),
    T("how much did the lanterns spend per vote", "none", focus="other", tags=[]),
    T("where was the gorsevane count held", "none", focus="where", tags=[]),
    T("what time was ashvenny south declared", "none", focus="when", tags=[]),
    T("is there going to be a recount in ashvenny south", "none", focus="other", tags=[]),
    T("who will lead the council now", "none", focus="other", tags=[]),
    T("will there be a coalition", "none", focus="other", tags=[]),
    T("what was the narrowest win of the night", "none", focus="margin", tags=[]),
    T("biggest majority tonight?", "none", focus="margin", tags=[]),
    T("how old is gaspard torvane", "none", focus="other", tags=[]),
    T("is kesia carravine a first time candidate", "none", focus="other", tags=[]),
    T("total number of votes cast across tamsendale?", "none", focus="count", tags=[]),
    T("how many spoiled papers in quellan cross", "none", focus="count", tags=[]),
    T("what's the harbour alliance's vote share countywide", "none", focus="other", tags=["contraction"]),
    T("who is the youngest councillor elected tonight", "none", focus="who", tags=[]),
    T("who won caddenmill at the last election", "none", focus="who", tags=[],
      never=["Nevin Corrigane"]),
    T("what's the capital of france", "none", focus="other", tags=[], outcome="not_understood"),
    T("set an alarm for 7", "none", focus="other", tags=[], outcome="not_understood"),
    T("qwpeori lkj", "none", focus="other", tags=[], outcome="not_understood"),
    T("who won the postal vote in caddenmill", "none", focus="who", tags=["constraint"],
      never=["Nevin Corrigane"]),
    T("among women candidates only, who won lanmouth", "none", focus="who", tags=["constraint"],
      never=["Ilsa Rookhaven"]),
    T("turnout percentage fennick green", "none", focus="other", tags=[]),
    T("any news on the mayoral race", "none", focus="other", tags=[]),
    T("what's aldo orrick's job", "none", focus="other", tags=["contraction"]),

    # ================= conversations
    C(T("who won ashvenny south in the end", "ward_winner", W(AS), "who", ["exact"], extra_never=stale_votes(AS)),
      T("by how much", "candidate_margin", P("c06", AS), "margin", ["follow_up", "ellipsis"], extra_never=stale_lead(AS)),
      T("was pellagan ahead earlier in the night", "none", focus="other", tags=["follow_up"]),
      tags=["follow_up"]),
    C(T("hi", "greeting", {}, "chat", []),
      T("final seat tally please", "seat_totals", {}, "table", []),
      T("how many did moorland get", "party_seats", G("moorland"), "count", ["follow_up"]),
      T("and harbour?", "party_seats", G("harbour"), "count", ["follow_up", "ellipsis"]),
      T("thanks, that's useful", "thanks", {}, "chat", []),
      tags=["follow_up"]),
    C(T("did delphy vardisse win", "candidate_result", P("c02"), "whether", []),
      T("who beat her", "candidate_margin", P("c02"), "who", ["pronoun", "follow_up"]),
      T("by how many", "candidate_margin", P("c02"), "margin", ["follow_up", "ellipsis"]),
      tags=["pronoun"]),
    C(T("did brannick win", "candidate_result", {}, "whether", ["ambiguous", "partial"], clarify=BRANNICK),
      T("tamsin", "candidate_result", P("c07"), "whether", ["follow_up", "partial"]),
      T("what about the other brannick", "candidate_result", P("c35"), "whether", ["follow_up"]),
      tags=["clarify", "ambiguous"]),
    C(T("who won ashvenny", "ward_winner", {}, "who", ["ambiguous", "partial"], clarify=ASH),
      T("north", "ward_winner", W(AN), "who", ["follow_up", "ellipsis"]),
      T("and the south one", "ward_winner", W(AS), "who", ["follow_up", "ellipsis"]),
      tags=["clarify", "ambiguous"]),
    C(T("how much of pellin heath was counted before they called it", "count_progress", W(PH), "status", []),
      T("who won it", "ward_winner", W(PH), "who", ["pronoun", "follow_up"]),
      T("what was the turnout", "none", focus="other", tags=["follow_up"]),
      tags=["follow_up"]),
    C(T("any races still open", "open_races", {}, "open", []),
      T("so whats the final seat count", "seat_totals", {}, "table", ["new_question"]),
      T("does anyone have an overall majority", "none", focus="other", tags=["follow_up"]),
      tags=["new_question"]),
    C(T("which party is kesia carravine", "candidate_party", P("c36"), "group_of", []),
      T("did she win", "candidate_result", P("c36"), "whether", ["pronoun", "follow_up"]),
      T("by how many votes?", "candidate_margin", P("c36"), "margin", ["follow_up", "ellipsis"]),
      T("who came second there", "ward_place", PL(QC, 2), "who", ["follow_up", "pronoun"]),
      tags=["pronoun", "follow_up"]),
    C(T("results from wrenlow sands", "ward_results", W(WS), "results", []),
      T("was there a recount", "none", focus="other", tags=["follow_up"]),
      T("who came third", "ward_place", PL(WS, 3), "who", ["follow_up", "ellipsis"]),
      tags=["follow_up"]),
    C(T("how did the lantern party do in brindle quay", "party_in_ward", PW("lantern", BQ), "how_did", []),
      T("same question for lanmouth", "party_in_ward", PW("lantern", LM), "how_did", ["follow_up", "ellipsis"]),
      T("how many seats did they win overall", "party_seats", G("lantern"), "count", ["pronoun", "follow_up"]),
      tags=["follow_up", "pronoun"]),
    C(T("is gaspard torvane ahead of sabeth pellagan", "candidates_compared", VS("c06", "c05"), "whether", []),
      T("by how much did he beat her", "candidate_margin", P("c06"), "margin", ["pronoun", "follow_up"]),
      T("ta very much", "thanks", {}, "chat", []),
      T("who won caddenmill", "ward_winner", W(CM), "who", ["new_question"]),
      tags=["thanks_between", "new_question"]),
    C(T("who won gorse vane", "ward_winner", W(GV), "who", ["voice", "mishearing"]),
      T("how many votes did tollgate get there", "party_in_ward", PW("tollgate", GV), "mark", ["voice", "follow_up"]),
      tags=["voice"]),
    C(T("whos the winner in fennick", "ward_winner", W(FG), "who", ["partial"]),
      T("what party is she", "candidate_party", P("c19"), "group_of", ["pronoun", "follow_up"]),
      T("what age is she", "none", focus="other", tags=["pronoun", "follow_up"]),
      tags=["pronoun"]),
    C(T("how did harbour do in marrowby", "party_in_ward", PW("harbour", MB), "how_did", []),
      T("so who took the seat", "ward_winner", W(MB), "who", ["follow_up", "ellipsis"]),
      tags=["follow_up"]),
    C(T("who won dunvarrick", "ward_winner", W(DV), "who", []),
      T("was the count finished", "count_progress", W(DV), "status", ["follow_up"]),
      T("why did they declare before it was all counted", "none", focus="other", tags=["follow_up"]),
      tags=["follow_up"]),
    C(T("what did the greens get in wrenlow sands", "party_in_ward", PW("greens", WS), "mark", []),
      T("so did yara glenvane win it", "candidate_result", P("c40", WS), "whether", ["follow_up"]),
      tags=["follow_up"]),
    C(T("who came 3rd in caddenmill", "ward_place", PL(CM, 3), "who", []),
      T("and last", "ward_place", PL(CM, 4), "who", ["follow_up", "ellipsis"]),
      T("what party was the last one", "candidate_party", P("c15"), "group_of", ["follow_up"]),
      tags=["follow_up", "ellipsis"]),
    C(T("joram hestermoor did he win", "candidate_result", P("c41"), "whether", []),
      T("how close did he get", "candidate_margin", P("c41"), "margin", ["pronoun", "follow_up"]),
      T("thanks a lot", "thanks", {}, "chat", []),
      tags=["pronoun"]),
    C(T("list of all the winners please", "none", focus="who", tags=[]),
      T("ok who won lanmouth", "ward_winner", W(LM), "who", []),
      T("and marrowby", "ward_winner", W(MB), "who", ["follow_up", "ellipsis"]),
      tags=["follow_up"]),
    C(T("good morning", "greeting", {}, "chat", []),
      T("what can i ask", "help", {}, "chat", []),
      T("how many seats for the independents", "party_seats", G("tollgate"), "count", ["partial"]),
      tags=["chatty"]),
    C(T("did harbour win pellin heath", "party_in_ward", PW("harbour", PH), "whether", []),
      T("whats the margin", "candidate_margin", P("c33", PH), "margin", ["follow_up", "ellipsis"]),
      tags=["follow_up"]),
    C(T("is vesna whitmarren ahead of talia yarrowby", "candidates_compared", VS("c31", "c32"), "whether", []),
      T("did either of them win", "ward_winner", W(MB), "whether", ["pronoun", "follow_up"]),
      tags=["pronoun"]),
    C(T("how much was counted in lanmouth", "count_progress", W(LM), "status", []),
      T("and the winner?", "ward_winner", W(LM), "who", ["follow_up", "ellipsis"]),
      T("what party", "candidate_party", P("c26"), "group_of", ["follow_up", "ellipsis"]),
      tags=["follow_up", "ellipsis"]),
    C(T("who finished second in brindle quay", "ward_place", PL(BQ, 2), "who", []),
      T("her party?", "candidate_party", P("c10"), "group_of", ["pronoun", "follow_up"]),
      T("how far behind the winner was she", "candidate_margin", P("c10"), "margin", ["pronoun", "follow_up"]),
      tags=["pronoun"]),
    C(T("who were the candidates in quellan cross and how did they do", "ward_results", W(QC), "results", []),
      T("which party does perrin farrowgate belong to", "candidate_party", P("c39"), "group_of", ["follow_up"]),
      T("how much did he spend", "none", focus="other", tags=["pronoun", "follow_up"]),
      tags=["follow_up"]),
    C(T("has every ward declared now", "open_races", {}, "open", []),
      T("what time did the last one come in", "none", focus="when", tags=["follow_up"]),
      tags=["follow_up"]),
    C(T("what was the winning margin in caddenmill", "ward_leader", W(CM), "margin", []),
      T("and who came last there", "ward_place", PL(CM, 4), "who", ["follow_up"]),
      tags=["follow_up"]),
    C(T("tollgate how did they do in quellan cross", "party_in_ward", PW("tollgate", QC), "how_did", ["partial"]),
      T("and in dunvarrick", "party_in_ward", PW("tollgate", DV), "how_did", ["follow_up", "ellipsis"]),
      T("so how many seats in total for them", "party_seats", G("tollgate"), "count", ["pronoun", "follow_up"]),
      tags=["follow_up"]),
    C(T("who won marrow bee", "ward_winner", W(MB), "who", ["voice", "mishearing"]),
      T("what party is rosamund vossary", "candidate_party", P("c30"), "group_of", ["voice", "mishearing"]),
      T("did vesna whitmarin get in", "candidate_result", P("c31"), "whether", ["voice", "mishearing"]),
      tags=["voice"]),
    C(T("how did orla quenlow do", "candidate_result", P("c01"), "how_did", []),
      T("who was second", "ward_place", PL(AN, 2), "who", ["follow_up", "ellipsis"]),
      T("how much did the greens get there", "party_in_ward", PW("greens", AN), "mark", ["follow_up", "pronoun"]),
      tags=["follow_up"]),
    C(T("who won?", "ward_winner", {}, "who", ["missing_slot"], clarify=[]),
      T("the quay", "ward_winner", W(BQ), "who", ["follow_up", "partial"]),
      T("and the full count there", "ward_results", W(BQ), "results", ["follow_up"]),
      tags=["clarify", "missing_slot"]),
    C(T("seat totals, just the top two", "seat_totals", {"count": "2"}, "table", []),
      T("how many did the greens end up with", "party_seats", G("greens"), "count", ["follow_up"]),
      T("were they up on last time", "none", focus="other", tags=["pronoun", "follow_up"]),
      tags=["follow_up"]),
    C(T("nevin corrigane v ulric fennow, who finished higher", "candidates_compared", VS("c12", "c13"), "compare", []),
      T("did corrigane hang on then", "candidate_result", P("c12"), "whether", ["partial", "follow_up"]),
      T("how big was the win", "candidate_margin", P("c12"), "margin", ["follow_up", "ellipsis"]),
      tags=["follow_up"]),
    C(T("who won the sands", "ward_winner", W(WS), "who", ["partial"]),
      T("what about the heath", "ward_winner", W(PH), "who", ["follow_up", "partial"]),
      T("and brindle", "ward_winner", W(BQ), "who", ["follow_up", "partial", "ellipsis"]),
      tags=["follow_up", "ellipsis"]),
    C(T("evening, or morning I guess! who won lanmouth town", "ward_winner", W(LM), "who", ["chatty", "partial"]),
      T("cheers. and how about quellan", "ward_winner", W(QC), "who", ["follow_up", "partial"]),
      T("what party is the person who came 2nd there", "candidate_party", P("c37"), "group_of", ["follow_up"]),
      T("how many votes were they behind", "candidate_margin", P("c37"), "margin", ["pronoun", "follow_up"]),
      tags=["chatty", "thanks_between"]),
    C(T("moorland progressives how did they do in ashvenny north", "party_in_ward", PW("moorland", AN), "how_did", []),
      T("did their candidate there win", "candidate_result", P("c02", AN), "whether", ["pronoun", "follow_up"]),
      T("how much did she lose by", "candidate_margin", P("c02", AN), "margin", ["pronoun", "follow_up"]),
      T("how many seats did moorland take overall", "party_seats", G("moorland"), "count", ["follow_up"]),
      tags=["pronoun"]),
]


def main():
    cases = build(EL, CASES)
    header = ("# Blind question set, round 4: scenario election, moment 03:45\n"
              "# (every replay batch applied, clock 2027-05-07T03:45+01:00).\n"
              "# Written by tests/eval/blind/round4/label_election_0345.py"
              " (facts computed from dataset-demo/election/).\n")
    out = os.path.join(os.path.dirname(os.path.abspath(__file__)), "election-0345.yaml")
    write(out, header, cases)
    print(stats(cases))


if __name__ == "__main__":
    main()
