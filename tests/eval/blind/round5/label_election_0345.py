"""Labels the election blind set at 03:45 (every replay batch applied,
clock 2027-05-07T03:45+01:00). Run: python3 label_election_0345.py"""
import os, sys, glob
sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from label_election_lib import T, C, build, standing, Facts, name, D

WW, WL, WP, WR, CP = 'ward_winner', 'ward_leader', 'ward_place', 'ward_results', 'count_progress'
PW, PS, ST, OR = 'party_in_ward', 'party_seats', 'seat_totals', 'open_races'
KP, KR, KM, KC = 'candidate_party', 'candidate_result', 'candidate_margin', 'candidates_compared'
N = 'none'
EARLY = Facts(5)   # the 23:45 state, for facts that would be from the wrong moment


def early_leader(k):
    """never: the 23:45 leader where he or she went on to lose."""
    def f(F):
        a = EARLY.ranked(k)[0]['competitor']
        w = F.ranked(k)[0]['competitor']
        return [name(a)] if a != w else []
    return f


def votes_only(cid):
    return lambda F: standing(cid)(F)[1:]


cases = [
    # ---------------- single questions ----------------
    T("Who won Ashvenny South?", WW, 'who', ['exact'], contest='ashvenny-south'),
    T("ashvenny north winner", WW, 'who', ['exact'], contest='ashvenny-north'),
    T("who took the seat at brindle quay", WW, 'who', ['voice'], contest='brindle-quay'),
    T("Caddenmill - who got elected?", WW, 'who', ['exact'], contest='caddenmill'),
    T("dunvarrik who won", WW, 'who', ['misspelling', 'voice'], contest='dunvarrick'),
    T("Fennick Green: winner please", WW, 'who', ['chatty'], contest='fennick-green'),
    T("who won gorse vane", WW, 'who', ['voice', 'mishearing'], contest='gorsevane'),
    T("who is the new councillor for lanmouth", WW, 'who', ['voice'], contest='lanmouth'),
    T("marowby result", WR, 'results', ['misspelling'], contest='marrowby'),
    T("who won on the heath", WW, 'who', ['partial'], contest='pellin-heath'),
    T("quellan x winner?", WW, 'who', ['abbreviation'], contest='quellan-cross'),
    T("has wrenlow sands been declared and who got it", WW, 'who', ['chatty'], contest='wrenlow-sands'),
    T("Final result in Wrenlow Sands, full numbers", WR, 'results', ['exact'], contest='wrenlow-sands'),
    T("give me the whole quellan cross declaration", WR, 'results', ['exact'], contest='quellan-cross'),
    T("brindle qy result pls", WR, 'results', ['abbreviation'], contest='brindle-quay'),
    T("what was the majority in Lanmouth", WL, 'margin', ['exact'], contest='lanmouth'),
    T("winning margin in caddenmill?", WL, 'margin', ['exact'], contest='caddenmill'),
    T("how many votes did Gaspard Torvane win by", KM, 'margin', ['exact'], competitor='c06'),
    T("by how much did Sabeth Pellagan lose", KM, 'margin', ['exact'], competitor='c05', never=['77']),
    T("how close did joram hestermoor get", KM, 'margin', ['voice'], competitor='c41'),
    T("How far behind was Ulric Fennow?", KM, 'margin', ['exact'], competitor='c13'),
    T("kesia carravine margin", KM, 'margin', ['exact'], competitor='c36'),
    T("did delphy vardisse win", KR, 'whether', ['voice'], competitor='c02'),
    T("Has Ameline Rennow been elected?", KR, 'whether', ['exact'], competitor='c17'),
    T("is Fianna Zellick in?", KR, 'whether', ['exact'], competitor='c33'),
    T("did oswin pembrev hold on", KR, 'whether', ['chatty'], competitor='c24'),
    T("Did Tove Inglemarsh get elected in the Sands?", KR, 'whether', ['partial'], competitor='c42'),
    T("who came 2nd in marrowby", WP, 'who', ['exact'], contest='marrowby', place='2'),
    T("third in quellan cross?", WP, 'who', ['exact'], contest='quellan-cross', place='3'),
    T("who finished last in ashvenny south", WP, 'who', ['exact'], contest='ashvenny-south', place='4'),
    T("who was fourth in brindle quay", WP, 'who', ['uncovered'], contest='brindle-quay', place='4'),
    T("second place fennick", WP, 'who', ['partial'], contest='fennick-green', place='2'),
    T("Final seat count please", ST, 'table', ['exact']),
    T("how many seats did each party get", ST, 'table', ['voice']),
    T("top two parties by seats", ST, 'table', ['constraint'], count='2'),
    T("How many seats did the Moorland Progressives win?", PS, 'count', ['exact'], group='moorland'),
    T("greens seats total", PS, 'count', ['partial'], group='greens'),
    T("how many did the lantern party get", PS, 'count', ['voice'], group='lantern'),
    T("tollgate independents how many councillors", PS, 'count', ['exact'], group='tollgate'),
    T("HAL seats?", PS, 'count', ['abbreviation'], group='harbour'),
    T("anything still to declare?", OR, 'open', ['chatty']),
    T("are any wards still counting", OR, 'open', ['voice']),
    T("how much of pellin heath was counted", CP, 'status', ['exact'], contest='pellin-heath'),
    T("is dunvarrick fully counted", CP, 'status', ['exact'], contest='dunvarrick'),
    T("gorsevane count finished?", CP, 'status', ['exact'], contest='gorsevane'),
    T("What party is Corin Gadrel from?", KP, 'group_of', ['exact'], competitor='c14'),
    T("which ward did elric ivenhall stand in", KP, 'group_of', ['voice'], competitor='c21'),
    T("who does maren umbersley represent", KP, 'group_of', ['exact'], competitor='c29'),
    T("brisa halvesk is she moorland", KP, 'group_of', ['voice'], competitor='c11'),
    T("did Vardisse beat Yellmer?", KC, 'compare', ['partial'], competitor='c02', rival='c03'),
    T("who finished higher, Gadrel or Ambrell", KC, 'compare', ['partial'], competitor='c14', rival='c15'),
    T("elsmyre v farrowgate", KC, 'compare', ['partial'], competitor='c38', rival='c39'),
    T("how did the Civic Greens do in Ashvenny South", PW, 'how_did', ['exact'], group='greens', contest='ashvenny-south'),
    T("tollgate quellan cross", PW, 'how_did', ['partial'], group='tollgate', contest='quellan-cross'),
    T("how did lantern do in marrowby", PW, 'how_did', ['partial'], group='lantern', contest='marrowby'),
    T("how did the Independents do in Lanmouth", PW, 'how_did', ['partial', 'uncovered'], group='tollgate', contest='lanmouth'),
    T("harbour alliance result in wrenlow", PW, 'how_did', ['partial'], group='harbour', contest='wrenlow-sands'),
    T("good evening", 'greeting', 'chat', ['chatty']),
    T("what sort of things can I ask you", 'help', 'chat', ['chatty']),
    T("What was the overall turnout across Tamsendale?", N, 'other', ['uncovered']),
    T("who will be the new council leader", N, 'other', ['uncovered']),
    T("is there a hung council", N, 'other', ['uncovered']),
    T("Which party got the most votes in total?", N, 'other', ['uncovered']),
    T("How many seats did Moorland win last time?", N, 'other', ['uncovered'], never=['four']),
    T("what was the swing in ashvenny south", N, 'other', ['uncovered']),
    T("will the greens go into coalition with harbour", N, 'other', ['uncovered']),
    T("what's gaspard torvane's email address", N, 'other', ['uncovered']),
    T("where was the wrenlow sands count held", N, 'where', ['uncovered']),
    T("what time was caddenmill declared", N, 'when', ['uncovered']),
    T("how many ballots were rejected in marrowby", N, 'other', ['uncovered']),
    T("Who won the Kestle Bay by-election?", WW, 'who', ['uncovered'], outcome='no_data'),
    T("who won the mayoralty", N, 'other', ['uncovered']),
    T("qwerty qwerty", N, 'other', ['gibberish'], outcome='not_understood'),
    T("whats the capital of peru", N, 'other', ['off_topic'], outcome='not_understood'),
    T("which ward had the smallest majority", N, 'margin', ['uncovered']),
    T("how many women were elected", N, 'count', ['uncovered']),
    T("ashvenny winner?", WW, 'who', ['ambiguous', 'partial'], says=['Ashvenny North', 'Ashvenny South']),
    T("did brannick get elected", KR, 'whether', ['ambiguous', 'partial'], says=['Tamsin Brannick', 'Quilla Brannick'], outcome='clarify'),
    T("who came third", WP, 'who', ['missing_slot'], place='3'),
    T("Who won the Caddenmill seat among voters under 30?", N, 'other', ['constraint', 'uncovered'], never=['Nevin Corrigane']),
    T("who won the postal vote in gorsevane", N, 'other', ['constraint', 'uncovered'], never=['Aldo Orrick']),
    T("what share did juna tullock get", N, 'other', ['uncovered']),
    T("were the ashvenny south votes recounted", N, 'other', ['uncovered']),
    T("nevin corrigan did he win caddenmill", KR, 'whether', ['misspelling', 'voice'], competitor='c12', contest='caddenmill'),
    T("ivo oscary how many votes", KR, 'mark', ['mishearing', 'voice'], competitor='c09', says=votes_only('c09'), outcome='answered'),
    T("how many votes did Mirela Stellick get", KR, 'mark', ['exact'], competitor='c27', says=votes_only('c27'), outcome='answered'),
    T("Where did Wynn Jessavy finish?", KR, 'rank', ['exact'], competitor='c22', says=standing('c22'), outcome='answered'),
    T("how did perrin farrowgate get on", KR, 'how_did', ['voice'], competitor='c39', says=standing('c39'), outcome='answered'),
    T("who beat nessa mirrowen", KM, 'who', ['voice'], competitor='c10'),
    T("who won in the quay", WW, 'who', ['partial'], contest='brindle-quay'),
    T("whats the final in the sands", WR, 'results', ['partial'], contest='wrenlow-sands'),
    T("how many votes separated the top two in dunvarrick", WL, 'margin', ['exact'], contest='dunvarrick'),
    T("pelin heath majority", WL, 'margin', ['misspelling'], contest='pellin-heath'),
    T("did the greens win fennick green", PW, 'whether', ['exact'], group='greens', contest='fennick-green'),
    T("which ward did kell thrane contest and for who", KP, 'group_of', ['exact'], competitor='c28'),
    T("what was the closest ward", N, 'margin', ['uncovered']),
    # ---------------- conversations ----------------
    C([
        T("I'm in Ashvenny South - who won?", WW, 'who', ['chatty', 'contraction'], contest='ashvenny-south', never=early_leader('ashvenny-south')),
        T("by how many votes was that", WL, 'margin', ['follow_up', 'ellipsis'], contest='ashvenny-south'),
        T("and who came second", WP, 'who', ['follow_up', 'ellipsis'], contest='ashvenny-south', place='2'),
        T("was it all counted", CP, 'status', ['follow_up'], contest='ashvenny-south'),
    ], ['voter', 'close_race']),
    C([
        T("how did the Harbour Alliance do in Caddenmill", PW, 'how_did', ['exact'], group='harbour', contest='caddenmill'),
        T("and in gorsevane", PW, 'how_did', ['follow_up', 'ellipsis'], group='harbour', contest='gorsevane'),
        T("and pellin heath?", PW, 'how_did', ['follow_up', 'ellipsis'], group='harbour', contest='pellin-heath'),
        T("how many seats altogether", PS, 'count', ['follow_up', 'ellipsis'], group='harbour'),
        T("how many votes did they poll across the whole county", N, 'count', ['uncovered', 'follow_up']),
    ], ['activist']),
    C([
        T("hello there", 'greeting', 'chat', ['chatty']),
        T("who won fennick green", WW, 'who', ['voice'], contest='fennick-green'),
        T("what party is she", KP, 'group_of', ['follow_up', 'pronoun'], competitor='c19'),
        T("and how did the lanterns do there", PW, 'how_did', ['follow_up'], group='lantern', contest='fennick-green'),
        T("thanks!", 'thanks', 'chat', ['chatty']),
    ], ['voice', 'listener']),
    C([
        T("wrenlow sands - who won", WW, 'who', ['exact'], contest='wrenlow-sands'),
        T("how tight was it", WL, 'margin', ['follow_up', 'pronoun'], contest='wrenlow-sands'),
        T("and the runner up?", WP, 'who', ['follow_up', 'ellipsis'], contest='wrenlow-sands', place='2'),
        T("which party's that", KP, 'group_of', ['follow_up', 'ellipsis'], competitor='c41'),
    ], ['close_race']),
    C([
        T("which brannick won", KR, 'whether', ['ambiguous'], says=['Tamsin Brannick', 'Quilla Brannick'], outcome='clarify'),
        T("quilla", KR, 'whether', ['follow_up', 'clarify', 'partial'], competitor='c35'),
        T("and tamsin?", KR, 'whether', ['follow_up', 'ellipsis'], competitor='c07'),
    ], ['ambiguous']),
    C([
        T("ashvenny results please", WR, 'results', ['ambiguous', 'partial'], says=['Ashvenny North', 'Ashvenny South']),
        T("the north one", WR, 'results', ['follow_up', 'clarify'], contest='ashvenny-north'),
        T("and the south one", WR, 'results', ['follow_up', 'ellipsis'], contest='ashvenny-south'),
    ], ['ambiguous']),
    C([
        T("seats by party", ST, 'table', ['exact']),
        T("how many for the lanterns", PS, 'count', ['follow_up', 'partial'], group='lantern'),
        T("where did they win", N, 'other', ['uncovered', 'pronoun']),
        T("did they win brindle quay", PW, 'whether', ['follow_up', 'pronoun'], group='lantern', contest='brindle-quay'),
    ], ['activist']),
    C([
        T("caddenmill who won and by how much", WL, 'margin', ['exact'], contest='caddenmill'),
        T("and the greens candidate there", PW, 'how_did', ['follow_up'], group='greens', contest='caddenmill'),
        T("how many votes did the lantern candidate get", PW, 'mark', ['follow_up'], group='lantern', contest='caddenmill'),
    ], ['reporter']),
    C([
        T("did torvane beat pellagan in the end", KC, 'compare', ['partial'], competitor='c06', rival='c05'),
        T("by how many", KM, 'margin', ['follow_up', 'ellipsis'], competitor='c06'),
        T("cheers mate", 'thanks', 'chat', ['thanks_between']),
        T("now quellan cross - was that close too", WL, 'margin', ['new_question'], contest='quellan-cross'),
        T("and the winner there", WW, 'who', ['follow_up', 'pronoun'], contest='quellan-cross'),
    ], ['close_race', 'thanks_between']),
    C([
        T("who won lanmouth town", WW, 'who', ['partial'], contest='lanmouth'),
        T("how much was counted there", CP, 'status', ['follow_up'], contest='lanmouth'),
        T("why not all of it", N, 'other', ['uncovered', 'follow_up']),
    ], ['voter']),
    C([
        T("how did the progressives do in marrowby", PW, 'how_did', ['partial'], group='moorland', contest='marrowby'),
        T("and quellan cross", PW, 'how_did', ['follow_up', 'ellipsis'], group='moorland', contest='quellan-cross'),
        T("and wrenlow", PW, 'how_did', ['follow_up', 'ellipsis'], group='moorland', contest='wrenlow-sands'),
        T("how many seats is that overall for them", PS, 'count', ['follow_up', 'pronoun'], group='moorland'),
    ], ['activist']),
    C([
        T("who won dunvarrick", WW, 'who', ['exact'], contest='dunvarrick'),
        T("which party is he", KP, 'group_of', ['follow_up', 'pronoun'], competitor='c16'),
        T("is that their only seat", PS, 'count', ['follow_up', 'pronoun'], group='tollgate'),
    ], ['reporter']),
    C([
        T("gorsevane top two", WR, 'results', ['constraint'], contest='gorsevane'),
        T("what was the gap", WL, 'margin', ['follow_up'], contest='gorsevane'),
        T("and who came third", WP, 'who', ['follow_up', 'ellipsis'], contest='gorsevane', place='3'),
    ], ['close_race']),
    C([
        T("did orla quenlow win", KR, 'whether', ['voice'], competitor='c01'),
        T("by what margin", KM, 'margin', ['follow_up', 'ellipsis'], competitor='c01'),
        T("who came second to her", WP, 'who', ['follow_up', 'pronoun'], contest='ashvenny-north', place='2'),
    ], ['voter']),
    C([
        T("pellin heath who won", WW, 'who', ['voice'], contest='pellin-heath'),
        T("what about the greens there", PW, 'how_did', ['follow_up', 'ellipsis'], group='greens', contest='pellin-heath'),
        T("and the progressives", PW, 'how_did', ['follow_up', 'ellipsis'], group='moorland', contest='pellin-heath'),
        T("how much of the vote was counted", CP, 'status', ['follow_up'], contest='pellin-heath'),
    ], ['activist']),
    C([
        T("fenwick savrelle did he win", KR, 'whether', ['voice'], competitor='c18'),
        T("where did he come", KR, 'rank', ['follow_up', 'pronoun'], competitor='c18', says=standing('c18'), outcome='answered'),
        T("who won his ward", WW, 'who', ['follow_up', 'pronoun'], contest='dunvarrick'),
    ], ['voter']),
    C([
        T("any races still open", OR, 'open', ['chatty']),
        T("ok so whats the final seat tally", ST, 'table', ['follow_up']),
        T("who has a majority", N, 'other', ['uncovered']),
    ], ['reporter']),
    C([
        T("brindle quay - how much was counted", CP, 'status', ['exact'], contest='brindle-quay'),
        T("who won it", WW, 'who', ['follow_up', 'pronoun'], contest='brindle-quay'),
        T("and whats the majority", WL, 'margin', ['follow_up'], contest='brindle-quay'),
    ], ['reporter']),
    C([
        T("hesper ambrell what party", KP, 'group_of', ['voice'], competitor='c15'),
        T("did she win", KR, 'whether', ['follow_up', 'pronoun'], competitor='c15'),
        T("who did", WW, 'who', ['follow_up', 'ellipsis'], contest='caddenmill'),
    ], ['voter']),
    C([
        T("compare odile yellmer and varian kestrove", KC, 'compare', ['exact'], competitor='c03', rival='c04'),
        T("and yellmer vs quenlow", KC, 'compare', ['follow_up'], competitor='c03', rival='c01'),
    ], ['compare']),
    C([
        T("how did the civic greens do in wrenlow sands", PW, 'how_did', ['exact'], group='greens', contest='wrenlow-sands'),
        T("and what about in dunvarrick", PW, 'how_did', ['follow_up', 'ellipsis', 'uncovered'], group='greens', contest='dunvarrick'),
        T("ok and lanmouth", PW, 'how_did', ['follow_up', 'ellipsis'], group='greens', contest='lanmouth'),
        T("so how many seats for the greens", PS, 'count', ['follow_up'], group='greens'),
    ], ['activist']),
    C([
        T("who won marrow bee", WW, 'who', ['voice', 'mishearing'], contest='marrowby'),
        T("and by how many votes", WL, 'margin', ['follow_up', 'ellipsis'], contest='marrowby'),
        T("whats the weather like tomorrow", N, 'other', ['uncovered', 'new_question']),
        T("ok back to marrowby who was last", WP, 'who', ['follow_up'], contest='marrowby', place='3'),
    ], ['listener']),
    C([
        T("how does this work", 'help', 'chat', []),
        T("who won the sands", WW, 'who', ['partial'], contest='wrenlow-sands'),
        T("did she beat hestermoor by much", KM, 'margin', ['follow_up', 'pronoun'], competitor='c40'),
    ], ['chat']),
    C([
        T("who won quellen cross", WW, 'who', ['misspelling'], contest='quellan-cross'),
        T("and what happened to caelan dunstreth", KR, 'how_did', ['follow_up'], competitor='c37', says=standing('c37'), outcome='answered'),
        T("how far off was that", KM, 'margin', ['follow_up', 'pronoun'], competitor='c37'),
    ], ['close_race']),
    C([
        T("how many seats have the independents got", PS, 'count', ['partial'], group='tollgate'),
        T("and harbour", PS, 'count', ['follow_up', 'ellipsis'], group='harbour'),
        T("and moorland", PS, 'count', ['follow_up', 'ellipsis'], group='moorland'),
        T("thanks very much", 'thanks', 'chat', ['chatty']),
    ], ['reporter']),
    C([
        T("Ilsa Rookhaven - elected?", KR, 'whether', ['exact'], competitor='c26'),
        T("majority?", KM, 'margin', ['follow_up', 'ellipsis'], competitor='c26'),
        T("who was 3rd in that ward", WP, 'who', ['follow_up', 'pronoun'], contest='lanmouth', place='3'),
    ], ['reporter']),
    C([
        T("who were the candidates in gorsevane and how many votes each", WR, 'results', ['exact'], contest='gorsevane'),
        T("did tollgate win there", PW, 'whether', ['follow_up'], group='tollgate', contest='gorsevane'),
    ], ['activist']),
    C([
        T("who won fenick green", WW, 'who', ['misspelling'], contest='fennick-green'),
        T("how many votes did pim wystrel get", KR, 'mark', ['follow_up'], competitor='c20', says=votes_only('c20'), outcome='answered'),
        T("was tullock ahead of wystrel all night", N, 'other', ['uncovered', 'follow_up']),
    ], ['compare']),
    C([
        T("caddenmill count - all done?", CP, 'status', ['exact'], contest='caddenmill'),
        T("and marrowby", CP, 'status', ['follow_up', 'ellipsis'], contest='marrowby'),
        T("and dunvarrick", CP, 'status', ['follow_up', 'ellipsis'], contest='dunvarrick'),
    ], ['reporter']),
    C([
        T("lantern party pellin heath", PW, 'how_did', ['exact'], group='lantern', contest='pellin-heath'),
        T("and in quellan cross then", PW, 'how_did', ['follow_up', 'ellipsis'], group='lantern', contest='quellan-cross'),
    ], ['activist']),
    C([
        T("did Ulric Fennow beat Nevin Corrigane?", KC, 'compare', ['exact'], competitor='c13', rival='c12'),
        T("how many votes in it", KM, 'margin', ['follow_up'], competitor='c13'),
        T("what percentage did each get", N, 'other', ['uncovered', 'follow_up']),
    ], ['compare']),
    C([
        T("madoc quaddle how'd he do", KR, 'how_did', ['contraction'], competitor='c25', says=standing('c25'), outcome='answered'),
        T("and oswin pembrev?", KR, 'how_did', ['follow_up', 'ellipsis'], competitor='c24', says=standing('c24'), outcome='answered'),
        T("who won that ward", WW, 'who', ['follow_up', 'pronoun'], contest='gorsevane'),
    ], ['voter']),
    C([
        T("did the harbour alliance win ashvenny north", PW, 'whether', ['exact'], group='harbour', contest='ashvenny-north'),
        T("and what was their majority", WL, 'margin', ['follow_up', 'pronoun'], contest='ashvenny-north'),
        T("thank u", 'thanks', 'chat', ['thanks_between']),
        T("and what about the south", PW, 'whether', ['follow_up', 'ellipsis'], group='harbour', contest='ashvenny-south'),
    ], ['activist', 'thanks_between']),
    C([
        T("rhosyn dretholm votes", KR, 'mark', ['exact'], competitor='c08', says=votes_only('c08'), outcome='answered'),
        T("which party is that", KP, 'group_of', ['follow_up', 'pronoun'], competitor='c08'),
        T("how many seats did they get", PS, 'count', ['follow_up', 'pronoun'], group='tollgate'),
    ], ['voter']),
    C([
        T("talia yarrowby or vesna whitmarren who did better", KC, 'compare', ['voice'], competitor='c32', rival='c31'),
        T("and did either of them win", WW, 'who', ['follow_up', 'pronoun'], contest='marrowby', never=[]),
    ], ['compare']),
    C([
        T("who won brindle", WW, 'who', ['partial'], contest='brindle-quay'),
        T("whats their phone number", N, 'other', ['uncovered', 'pronoun']),
        T("fine, which party are they", KP, 'group_of', ['follow_up', 'pronoun'], competitor='c09'),
    ], ['voter']),
]

cases += [
    T("LAN v CGR seats", N, 'compare', ['abbreviation', 'uncovered']),
    T("who got the most votes of any candidate tonight", N, 'other', ['uncovered']),
    T("Juna Tullock's majority?", KM, 'margin', ['exact'], competitor='c19'),
    T("who won ashvenny north and what was the number of votes", WW, 'who', ['exact'], contest='ashvenny-north'),
    T("caddenmill who was runner up", WP, 'who', ['exact'], contest='caddenmill', place='2'),
    T("who came first in the heath", WP, 'who', ['number_words', 'partial'], contest='pellin-heath', place='1'),
    T("Has Bastien Elsmyre won a seat?", KR, 'whether', ['exact'], competitor='c38'),
    T("is yara glenvane a green", KP, 'group_of', ['voice'], competitor='c40'),
    T("did the lanterns win in lanmouth", PW, 'whether', ['partial'], group='lantern', contest='lanmouth'),
    C([
        T("lanmouth full result", WR, 'results', ['exact'], contest='lanmouth'),
        T("was stellick ahead of thrane", KC, 'compare', ['follow_up', 'partial'], competitor='c27', rival='c28'),
        T("and by how much did stellick lose", KM, 'margin', ['follow_up'], competitor='c27'),
    ], ['compare']),
    C([
        T("is counting over in all the wards", OR, 'open', ['chatty']),
        T("what was counted in brindle quay then", CP, 'status', ['follow_up'], contest='brindle-quay'),
        T("when will the rest of it be counted", N, 'when', ['uncovered', 'follow_up']),
    ], ['reporter']),
    C([
        T("how did varian kestrove do", KR, 'how_did', ['voice'], competitor='c04', says=standing('c04'), outcome='answered'),
        T("and the other green in that area, in ashvenny south", PW, 'how_did', ['follow_up'], group='greens', contest='ashvenny-south'),
        T("did tamsin brannick at least get in", KR, 'whether', ['follow_up'], competitor='c07'),
    ], ['activist']),
    C([
        T("dunvarrick - who were the candidates", WR, 'results', ['exact'], contest='dunvarrick'),
        T("what did the progressives get there", PW, 'mark', ['follow_up'], group='moorland', contest='dunvarrick'),
        T("and the winner's margin", WL, 'margin', ['follow_up', 'ellipsis'], contest='dunvarrick'),
    ], ['activist']),
    C([
        T("who beat aldo orrick", KM, 'who', ['exact'], competitor='c23'),
        T("oh so he won - by how many then", KM, 'margin', ['follow_up', 'pronoun'], competitor='c23'),
    ], ['voter']),
]

if __name__ == '__main__':
    here = os.path.dirname(os.path.abspath(__file__))
    build(cases, 99, os.path.join(here, 'election-0345.yaml'), '03:45 (every replay batch applied, clock 2027-05-07T03:45+01:00)', 'label_election_0345.py')
