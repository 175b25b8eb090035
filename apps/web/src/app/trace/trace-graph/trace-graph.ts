import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { Router } from '@angular/router';
import { type Edge, GraphComponent, LayoutService, type Node } from '@swimlane/ngx-graph';
import type { TraceEdge, TraceNode, TraceNodeKind } from '@batchproof/shared';

/** The most nodes drawn; a bigger trace is read in its tables (a graph that size reads as noise). */
export const MAX_DRAWN_NODES = 80;

const NODE_WIDTH = 188;
const NODE_HEIGHT = 52;
/** Vertical room a node takes in its column, with the gap dagre leaves between nodes. */
const ROW_HEIGHT = NODE_HEIGHT + 28;

/** How each kind of node is named in its second line and its link's accessible name. */
const KIND_WORDS: Record<TraceNodeKind, string> = {
  'supplier-lot': 'Supplier lot',
  batch: 'Batch',
  customer: 'Customer',
  supplier: 'Supplier',
  document: 'Document',
};

/** The page a node opens, or null (a document opens from its lot's or material's page). */
export function traceNodeLink(node: Pick<TraceNode, 'kind' | 'recordId'>): string | null {
  switch (node.kind) {
    case 'supplier-lot':
      return `/lots/${node.recordId}`;
    case 'batch':
      return `/production/${node.recordId}`;
    case 'customer':
      return `/deliveries/customers/${node.recordId}`;
    case 'supplier':
      return `/suppliers/${node.recordId}`;
    case 'document':
      return null;
  }
}

/** Cuts text to `max` characters with an ellipsis, so it stays inside its box. */
const fit = (text: string, max: number) =>
  text.length > max ? `${text.slice(0, max - 1)}…` : text;

interface NodeData {
  kind: TraceNodeKind;
  caption: string;
  href: string | null;
  name: string;
}

/**
 * A trace as a left-to-right graph (ngx-graph, dagre layout): supplier and documents → supplier
 * lots → batches → customers, quantities on the arrows. Each node is a link to its page. The
 * figure carries a one-sentence summary as its accessible name; the tables beside it are the
 * full reading.
 */
@Component({
  selector: 'bp-trace-graph',
  imports: [GraphComponent],
  // The graph finds its layouts through this service, which its NgModule would otherwise provide.
  providers: [LayoutService],
  template: `
    <figure class="figure" role="group" [attr.aria-label]="summary()">
      @if (tooBig()) {
        <p class="note">
          This trace has {{ nodes().length }} points, too many to draw legibly; the tables list them
          all.
        </p>
      } @else {
        <div class="canvas" [style.height.px]="height()">
          <ngx-graph
            layout="dagre"
            [layoutSettings]="layoutSettings"
            [nodes]="graphNodes()"
            [links]="graphLinks()"
            [nodeWidth]="nodeWidth"
            [nodeHeight]="nodeHeight"
            [autoZoom]="true"
            [autoCenter]="true"
            [enableZoom]="false"
            [enablePan]="false"
            [enableDrag]="false"
            [animate]="false"
          >
            <ng-template #defsTemplate>
              <svg:marker
                id="bp-trace-arrow"
                viewBox="0 -5 10 10"
                refX="8"
                refY="0"
                markerWidth="5"
                markerHeight="5"
                orient="auto"
              >
                <svg:path d="M0,-5L10,0L0,5" class="arrow-head" />
              </svg:marker>
            </ng-template>
            <ng-template #nodeTemplate let-node>
              @if (node.data.href) {
                <svg:a
                  class="trace-node"
                  [attr.href]="node.data.href"
                  [attr.data-kind]="node.data.kind"
                  [attr.aria-label]="node.data.name"
                  (click)="open($event, node.data.href)"
                >
                  <svg:rect [attr.width]="nodeWidth" [attr.height]="nodeHeight" rx="8" ry="8" />
                  <svg:text x="12" y="21" class="label">{{ node.label }}</svg:text>
                  <svg:text x="12" y="40" class="caption">{{ node.data.caption }}</svg:text>
                </svg:a>
              } @else {
                <svg:g class="trace-node" [attr.data-kind]="node.data.kind">
                  <svg:title>{{ node.data.name }}</svg:title>
                  <svg:rect [attr.width]="nodeWidth" [attr.height]="nodeHeight" rx="8" ry="8" />
                  <svg:text x="12" y="21" class="label">{{ node.label }}</svg:text>
                  <svg:text x="12" y="40" class="caption">{{ node.data.caption }}</svg:text>
                </svg:g>
              }
            </ng-template>
            <ng-template #linkTemplate let-link>
              <svg:g class="trace-edge">
                <svg:path class="line" marker-end="url(#bp-trace-arrow)" />
                @if (link.midPoint) {
                  <svg:text
                    class="edge-label"
                    text-anchor="middle"
                    [attr.x]="link.midPoint.x"
                    [attr.y]="link.midPoint.y - 6"
                  >
                    {{ link.label }}
                  </svg:text>
                }
              </svg:g>
            </ng-template>
          </ngx-graph>
        </div>
      }
    </figure>
  `,
  styles: `
    :host {
      display: block;
    }
    .figure {
      margin: 0;
    }
    .canvas {
      width: 100%;
      min-height: 160px;
      overflow: hidden;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-surface-container-lowest);
    }
    .note {
      color: var(--mat-sys-on-surface-variant);
    }
    .trace-node rect {
      fill: var(--mat-sys-surface-container-high);
      stroke: var(--mat-sys-outline);
      stroke-width: 1;
    }
    .trace-node[data-kind='supplier-lot'] rect {
      fill: var(--mat-sys-tertiary-container);
    }
    .trace-node[data-kind='batch'] rect {
      fill: var(--mat-sys-primary-container);
    }
    .trace-node[data-kind='customer'] rect {
      fill: var(--mat-sys-secondary-container);
    }
    a.trace-node {
      cursor: pointer;
    }
    a.trace-node:hover rect,
    a.trace-node:focus-visible rect {
      stroke: var(--mat-sys-primary);
      stroke-width: 3;
    }
    .trace-node .label {
      font: var(--mat-sys-label-large);
      fill: var(--mat-sys-on-surface);
      text-decoration: underline;
    }
    g.trace-node .label {
      text-decoration: none;
    }
    .trace-node .caption {
      font: var(--mat-sys-body-small);
      fill: var(--mat-sys-on-surface-variant);
    }
    .trace-edge .line {
      fill: none;
      stroke: var(--mat-sys-outline);
      stroke-width: 1.5;
    }
    .arrow-head {
      fill: var(--mat-sys-outline);
    }
    .edge-label {
      font: var(--mat-sys-label-small);
      fill: var(--mat-sys-on-surface);
      paint-order: stroke;
      stroke: var(--mat-sys-surface-container-lowest);
      stroke-width: 4px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TraceGraph {
  readonly nodes = input.required<readonly TraceNode[]>();
  readonly edges = input.required<readonly TraceEdge[]>();
  /** One sentence saying what the graph shows, for screen readers. */
  readonly summary = input.required<string>();

  private readonly router = inject(Router);
  protected readonly nodeWidth = NODE_WIDTH;
  protected readonly nodeHeight = NODE_HEIGHT;
  protected readonly layoutSettings = { orientation: 'LR', rankPadding: 90, nodePadding: 24 };

  protected readonly tooBig = computed(() => this.nodes().length > MAX_DRAWN_NODES);

  /** Plain ids for the drawing (they become element ids); the trace's ids map onto them. */
  private readonly ids = computed(
    () => new Map(this.nodes().map((n, i) => [n.id, `bp-trace-node-${i}`] as const)),
  );

  protected readonly graphNodes = computed<Node[]>(() =>
    this.nodes().map((n) => {
      const kind = KIND_WORDS[n.kind];
      const data: NodeData = {
        kind: n.kind,
        caption: fit(n.detail ? `${kind} · ${n.detail}` : kind, 30),
        href: traceNodeLink(n),
        name: n.detail ? `${kind} ${n.label}, ${n.detail}` : `${kind} ${n.label}`,
      };
      return { id: this.ids().get(n.id)!, label: fit(n.label, 22), data };
    }),
  );

  protected readonly graphLinks = computed<Edge[]>(() =>
    this.edges().map((e, i) => ({
      id: `bp-trace-edge-${i}`,
      source: this.ids().get(e.from)!,
      target: this.ids().get(e.to)!,
      label: e.label,
    })),
  );

  /** Tall enough for the fullest column, so nothing shrinks below legible on a wide screen. */
  protected readonly height = computed(() => {
    const ranks = new Map<string, number>();
    // Nodes per column: a node's column is one past its furthest source (the graph has no cycles).
    const rankOf = (id: string, seen = new Set<string>()): number => {
      if (ranks.has(id)) return ranks.get(id)!;
      if (seen.has(id)) return 0;
      seen.add(id);
      const sources = this.edges().filter((e) => e.to === id);
      const rank = sources.length ? 1 + Math.max(...sources.map((e) => rankOf(e.from, seen))) : 0;
      ranks.set(id, rank);
      return rank;
    };
    const perRank = new Map<number, number>();
    for (const n of this.nodes()) {
      const r = rankOf(n.id);
      perRank.set(r, (perRank.get(r) ?? 0) + 1);
    }
    const fullest = Math.max(1, ...perRank.values());
    return Math.min(720, 40 + fullest * ROW_HEIGHT);
  });

  /** Follows a node's link inside the app; a modified click opens it as the browser would. */
  protected open(event: MouseEvent, href: string): void {
    if (event.button !== 0 || event.ctrlKey || event.metaKey || event.shiftKey || event.altKey)
      return;
    event.preventDefault();
    void this.router.navigateByUrl(href);
  }
}
