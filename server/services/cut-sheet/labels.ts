// The cut sheet's words: each label in English with its simplified Chinese beneath. Trade terms as
// the toolroom says them (模具 tool, 型腔 cavity, 型芯 core, 镶件 insert, 烧焊 weld, 放电加工 EDM,
// 试模 mold trial, 首件 first article, 缩水 shrink, 钢料 steel, 改模单 cut sheet).
import type { ItemMethod, PartEffect, SafetyFlag, SizeUnit } from '../../../shared/schemas/change-items';
import type { RequestState } from '../../../shared/domain/lifecycle';

/** One label in both languages. */
export interface Bilingual {
  en: string;
  zh: string;
}

const b = (en: string, zh: string): Bilingual => ({ en, zh });

export const L = {
  sheet: b('Cut sheet', '改模单'),
  request: b('Request', '改模申请'),
  title: b('Change', '修改内容'),
  state: b('State', '状态'),
  tool: b('Tool', '模具'),
  toolName: b('Tool name', '模具名称'),
  revision: b('Made against revision', '依据版本'),
  factory: b('Factory', '工厂'),
  weight: b('Tool weight', '模具重量'),
  derivative: b('Derivative product', '衍生产品'),
  noDerivative: b('No derivative product', '无衍生产品'),
  reason: b('Reason', '修改原因'),
  items: b('Cut items', '改模项目'),
  part: b('Part', '零件'),
  effect: b('What happens to the part', '零件变化'),
  method: b('Method', '加工方法'),
  size: b('Size', '尺寸'),
  steelAction: b('Steel action', '钢料处理'),
  undoPath: b('Undo path', '复原方法'),
  note: b('Note', '备注'),
  safety: b('Safety flags', '安全标记'),
  none: b('None', '无'),
  steelSize: b('Shrink-compensated steel size', '缩水补偿后的钢料尺寸'),
  oldPart: b('Part dimension now', '现零件尺寸'),
  newPart: b('Part dimension wanted', '目标零件尺寸'),
  oldSteel: b('Steel now', '现钢料尺寸'),
  newSteel: b('Steel after the cut', '加工后钢料尺寸'),
  shrink: b('Shrink', '缩水率'),
  images: b('Images with the marked regions', '图片及标记区域'),
  before: b('Before', '修改前'),
  after: b('After', '修改后'),
  noImages: b('No before or after images on this request.', '本申请没有修改前或修改后的图片。'),
  ended: b('Products this change ends', '本次修改后无法再生产的产品'),
  endedNone: b('This change ends no product.', '本次修改不影响任何产品的生产。'),
  cautions: b('Cautions', '注意事项'),
  lifting: b('Lifting the tool', '模具吊装'),
  record: b('Sign-off record', '签核记录'),
  signer: b('Printed name', '签名人'),
  role: b('Role', '角色'),
  meaning: b('Meaning', '签核含义'),
  signedAt: b('Time (UTC)', '时间 (UTC)'),
  noSignOffs: b('Nothing signed yet.', '尚无签核。'),
  chainHead: b('Hash-chain head', '哈希链末端'),
  check: b('How to check', '核对方法'),
  contentHash: b('Content', '内容'),
  firstArticle: b('First-article report', '首件报告'),
  intended: b('Intended', '目标尺寸'),
  measured: b('Measured', '实测尺寸'),
  result: b('Result', '结果'),
  pass: b('Pass', '合格'),
  fail: b('Fail', '不合格'),
  trial: b('Mold trial', '试模'),
  stamp: b('NOT FOR CUTTING', '不得用于加工'),
  stampNote: b(
    'This request is not cleared to cut yet: do not cut steel from this sheet.',
    '本申请尚未批准加工：不得依据本单加工钢料。',
  ),
} as const;

export const effectLabels: Record<PartEffect, Bilingual> = {
  gains_plastic: b('Part gains plastic', '零件加胶'),
  loses_plastic: b('Part loses plastic', '零件减胶'),
  surface_only: b('Surface finish only', '仅改表面'),
  insert_swapped: b('Insert swapped', '更换镶件'),
};

export const methodLabels: Record<ItemMethod, Bilingual> = {
  cut: b('Cut (milling or EDM)', '加工去钢料（铣削或放电加工）'),
  weld_recut: b('Weld, then re-cut', '烧焊后重新加工'),
  new_insert: b('Replacement insert (old one kept)', '新做镶件（保留旧镶件）'),
  texture: b('Texture', '蚀纹'),
  polish: b('Polish', '抛光'),
};

export const steelActionLabels: Record<string, Bilingual> = {
  remove: b('Steel comes out', '去钢料'),
  add: b('Steel is added (weld)', '加钢料（烧焊）'),
  none: b('Steel untouched', '钢料不变'),
  swap: b('Insert swapped, old one kept', '更换镶件，保留旧镶件'),
};

export const undoPathLabels: Record<string, Bilingual> = {
  none: b('Nothing to undo', '无需复原'),
  reweld_and_recut: b('Only by a new weld and re-cut (not a restoration)', '只能再次烧焊并重新加工（无法恢复原状）'),
  swap_back: b('Swap the old insert back', '装回旧镶件'),
};

export const unitLabels: Record<SizeUnit, string> = { mm: 'mm', in: 'in' };

export const flagLabels: Record<SafetyFlag, Bilingual> = {
  small_part: b('May create a small part', '可能产生小零件'),
  point_or_edge: b('May create a point or edge', '可能产生尖点或锐边'),
  thin_wall: b('Changes a wall a child could break', '改变儿童可能弄断的胶位'),
};

export const stateLabels: Record<RequestState, Bilingual> = {
  draft: b('Draft', '草稿'),
  engineering_review: b('Engineering review', '工程审核'),
  brand_approval: b('Brand approval', '品牌批准'),
  cut_authorized: b('Cleared to cut', '已批准加工'),
  samples_review: b('First samples review', '首件审核'),
  closed: b('Closed', '已结案'),
  declined: b('Declined', '已拒绝'),
  withdrawn: b('Withdrawn', '已撤回'),
};

export const roleLabels: Record<string, Bilingual> = {
  admin: b('Administrator', '管理员'),
  designer: b('Designer', '设计师'),
  engineer: b('Tooling engineer', '模具工程师'),
  brand_lead: b('Brand lead', '品牌负责人'),
  toolmaker: b('Toolmaker', '模具师傅'),
};

/** The footer's page count, in both languages. */
export const pageOf = (n: number, total: number) => `page ${n} of ${total} · 第 ${n} 页 / 共 ${total} 页`;

/** How a reader checks the record of this request. */
export const checkLine = (requestId: string) =>
  b(
    `Open the request in Toolgate and press "Check record", or ask GET /api/requests/${requestId}/sign-offs/verify: it recomputes every hash and must end at the head above.`,
    '在 Toolgate 中打开本申请并点击“Check record”（核对记录），系统会重新计算每一个哈希值，结果必须与上面的链末端一致。',
  );
