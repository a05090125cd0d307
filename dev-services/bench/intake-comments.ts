/**
 * The comments `npm run bench:intake` imports, with the ask each one is really about (the ground truth
 * its precision and recall are measured against).
 *
 * How the generator makes its asks and their near-duplicates: an ask is a subject, an action and a
 * target from three lists of 31 (invented workshop phrases); the ask for (a, b) takes target (a + b)
 * mod 31, so two asks share at most one of the three parts (as distinct viewer asks often share a tool
 * or a goal). Asks are drawn with a skew (a few asked hundreds of times, most a handful). Each copy is
 * then changed the way people write the same thing:
 * - reworded: one of a dozen openings ("Can you make", "I'd love to see", "Next video:") and
 *   closings ("please!!", "for science"), verbs in another form ("climb" / "climbing");
 * - misspelt: in half the copies one or two words of five letters or more get a letter dropped,
 *   doubled or swapped with its neighbour;
 * - reordered: in a third of the copies the target comes first ("A flight of stairs: a cordless drill climbing it").
 */
const SUBJECTS = `a cordless drill|a leaf blower|a toaster element|a bicycle dynamo|a shopping trolley|a potato cannon|a lawn mower engine|a washing machine motor|a hot glue gun|a solar panel|a car jack|a microwave transformer|a fridge compressor|a paper airplane|a cardboard boat|a 3D printed gear|a hydraulic press|a model rocket|a Tesla coil|a kitchen blender|a sewing machine|a garden hose|a stack of magnets|a fidget spinner|an office chair|a belt sander|a pressure washer|a ceiling fan|a skateboard truck|a bathroom scale|a claw hammer`.split("|");
const ACTIONS = `climb|lift|tow|launch|power|cool|heat|crush|spin|float|carry|pump|cut|light|charge|balance|stop|throw|melt|push|sort|grip|measure|fold|steer|bounce|shred|dry|freeze|wind|weld`.split("|");
const TARGETS = `a flight of stairs|a family car|a garden shed|a bowling ball|a small boat|a pizza oven|a cinder block|a wooden pallet|a water tank|a tennis ball|a camping tent|a ceramic mug|a steel beam|a pumpkin|a snowman|a bag of cement|a scooter|a watermelon|a beehive|a phone battery|a treehouse|a canoe|an ice block|a paddling pool|a robot arm|a go-kart|a hammock|a bookshelf|a dartboard|a kite|a drum kit`.split("|");
export const N = SUBJECTS.length;
const OPENINGS = ["Can", "Can you make", "I'd love to see if", "Please try to make", "Next video:", "Could someone test whether", "Challenge idea:", "Would it be possible for", "What if", "Try making", "Hey, can", "Idea:"];
const CLOSINGS = ["", "", "?", "?!", " please!!", " for science", " - would watch", " lol", " next episode?", "!"];
const VERB_FORMS = (verb: string) => [verb, `${verb.replace(/e$/, "")}ing`, `${verb}s`];

/** A small generator (mulberry32) started from a fixed number, so every run writes the same comments. */
function random(start: number) {
  let a = start >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
type Rand = ReturnType<typeof random>;
const pick = <T>(rand: Rand, list: readonly T[]) => list[Math.floor(rand() * list.length)]!;

function misspell(rand: Rand, word: string): string {
  if (word.length < 5) return word;
  const i = 1 + Math.floor(rand() * (word.length - 2));
  const kind = Math.floor(rand() * 3);
  if (kind === 0) return word.slice(0, i) + word.slice(i + 1);
  if (kind === 1) return word.slice(0, i) + word[i] + word.slice(i);
  return word.slice(0, i) + word[i + 1] + word[i] + word.slice(i + 2);
}

function variant(rand: Rand, ask: number): string {
  const a = Math.floor(ask / N);
  const b = ask % N;
  const subject = SUBJECTS[a]!;
  const action = pick(rand, VERB_FORMS(ACTIONS[b]!));
  const target = TARGETS[(a + b) % N]!;
  let text = rand() < 1 / 3 ? `${target[0]!.toUpperCase()}${target.slice(1)}: ${subject} ${action} it` : `${pick(rand, OPENINGS)} ${subject} ${action} ${target}`;
  text += pick(rand, CLOSINGS);
  if (rand() < 0.5) {
    const words = text.split(" ");
    for (let k = 0; k < 1 + Math.floor(rand() * 2); k++) {
      const at = Math.floor(rand() * words.length);
      words[at] = misspell(rand, words[at]!);
    }
    text = words.join(" ");
  }
  return text;
}

export interface Comment {
  id: string;
  author: string;
  text: string;
  ask: number;
}

/** `rows` comments over `asks` asks drawn with a skew (rank r asked about 1/r^0.9 as often as the first). */
export function comments(rows: number, asks: number, start: number, prefix: string): Comment[] {
  const rand = random(start);
  const order = Array.from({ length: N * N }, (_, i) => i).sort(() => rand() - 0.5).slice(0, asks);
  const weights = order.map((_, r) => 1 / (r + 1) ** 0.9);
  const total = weights.reduce((s, w) => s + w, 0);
  const out: Comment[] = [];
  for (let i = 0; i < rows; i++) {
    let x = rand() * total;
    let r = 0;
    while (r < weights.length - 1 && (x -= weights[r]!) > 0) r++;
    out.push({ id: `${prefix}-${i}`, author: `viewer${Math.floor(rand() * rows * 0.6)}`, text: variant(rand, order[r]!), ask: order[r]! });
  }
  return out;
}

