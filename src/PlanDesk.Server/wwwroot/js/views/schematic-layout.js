// Where each element of the schematic goes: columns from the network's structure (plants, the tanks at each
// plant, regional reservoirs by how many pipelines they are from a plant, customers), and rows that keep each
// element near what feeds it without overlapping.

export const size = {
  plantWidth: 250, tankWidth: 220, customerWidth: 240, columnGap: 80,
  plantHeader: 46, stageRow: 22, tankHeight: 46, customerHeight: 46, rowGap: 10, groupGap: 26, margin: 16,
};

function plantHeight(plant) {
  return size.plantHeader + size.stageRow * (plant.stages.length + (plant.engineUse ? 1 : 0)) + 8;
}

/** Depth of each tank: 1 for tanks at a plant, 1 + deepest source for reservoirs fed by pipelines. */
function tankDepths(schematic) {
  const depth = new Map(schematic.tanks.map(t => [t.tankId, t.plantId ? 1 : 2]));
  const intoTanks = schematic.pipelines.filter(p => p.toKind === 'tank');
  for (let pass = 0; pass < schematic.tanks.length; pass++) {
    let changed = false;
    for (const pipe of intoTanks) {
      const target = schematic.tanks.find(t => t.tankId === pipe.toId);
      const wanted = (depth.get(pipe.fromTankId) ?? 1) + 1;
      if (target && !target.plantId && depth.get(target.tankId) < wanted) {
        depth.set(target.tankId, wanted);
        changed = true;
      }
    }
    if (!changed) {
      break;
    }
  }
  return depth;
}

/** Places boxes of one column at their wanted y in order, pushing each down below the one before. */
function stack(items, height, gap) {
  items.sort((a, b) => a.wanted - b.wanted);
  let next = size.margin;
  for (const item of items) {
    item.y = Math.max(item.wanted, next);
    next = item.y + height(item) + gap;
  }
}

/**
 * Which plant's row each customer is drawn in: the mean position of the plants whose water reaches it (through
 * reservoirs too), so a customer sits beside the plants that serve it and no column drifts away from the others.
 */
function customerRows(schematic) {
  const plantIndex = new Map(schematic.plants.map((p, i) => [p.plantId, i]));
  const sourcesOf = id => schematic.pipelines.filter(p => p.toId === id).map(p => p.fromTankId);
  const tankRow = new Map();
  const rowOfTank = (tankId, seen = new Set()) => {
    if (tankRow.has(tankId)) {
      return tankRow.get(tankId);
    }
    const tank = schematic.tanks.find(t => t.tankId === tankId);
    let row = null;
    if (tank?.plantId && plantIndex.has(tank.plantId)) {
      row = plantIndex.get(tank.plantId);
    } else if (!seen.has(tankId)) {
      seen.add(tankId);
      const rows = sourcesOf(tankId).map(source => rowOfTank(source, seen)).filter(r => r !== null);
      row = rows.length ? rows.reduce((a, b) => a + b, 0) / rows.length : null;
    }
    tankRow.set(tankId, row);
    return row;
  };
  const last = Math.max(0, schematic.plants.length - 1);
  return new Map(schematic.customers.map(customer => {
    const rows = sourcesOf(customer.customerId).map(source => rowOfTank(source)).filter(r => r !== null);
    return [customer.customerId, rows.length ? Math.round(rows.reduce((a, b) => a + b, 0) / rows.length) : last];
  }));
}

/** Returns boxes {x, y, width, height} for plants, tanks and customers, and the drawing's size. */
export function layout(schematic) {
  const depth = tankDepths(schematic);
  const maxDepth = Math.max(1, ...depth.values());
  const columnX = [size.margin];
  columnX.push(columnX[0] + size.plantWidth + size.columnGap);
  for (let d = 2; d <= maxDepth; d++) {
    columnX.push(columnX[d - 1] + size.tankWidth + size.columnGap);
  }
  const customerX = columnX[maxDepth] + size.tankWidth + size.columnGap;
  const boxes = new Map();
  const rowOf = customerRows(schematic);

  // One row per plant: the plant, its tanks beside it and the customers it serves at the right, as tall as the tallest.
  let y = size.margin;
  schematic.plants.forEach((plant, index) => {
    const height = plantHeight(plant);
    boxes.set(`plant:${plant.plantId}`, { x: columnX[0], y, width: size.plantWidth, height });
    let tankY = y;
    for (const tank of schematic.tanks.filter(t => t.plantId === plant.plantId)) {
      boxes.set(`tank:${tank.tankId}`, { x: columnX[1], y: tankY, width: size.tankWidth, height: size.tankHeight });
      tankY += size.tankHeight + size.rowGap;
    }
    let customerY = y;
    for (const customer of schematic.customers.filter(c => rowOf.get(c.customerId) === index)) {
      boxes.set(`customer:${customer.customerId}`, { x: customerX, y: customerY, width: size.customerWidth, height: size.customerHeight });
      customerY += size.customerHeight + size.rowGap;
    }
    y = Math.max(y + height, tankY - size.rowGap, customerY - size.rowGap) + size.groupGap;
  });
  // Anything without a plant row (a network of reservoirs only) goes below.
  for (const tank of schematic.tanks.filter(t => t.plantId && !boxes.has(`tank:${t.tankId}`))) {
    boxes.set(`tank:${tank.tankId}`, { x: columnX[1], y, width: size.tankWidth, height: size.tankHeight });
    y += size.tankHeight + size.rowGap;
  }
  for (const customer of schematic.customers.filter(c => !boxes.has(`customer:${c.customerId}`))) {
    boxes.set(`customer:${customer.customerId}`, { x: customerX, y, width: size.customerWidth, height: size.customerHeight });
    y += size.customerHeight + size.rowGap;
  }

  // Reservoirs, column by column, level with the tanks that fill them.
  const centreOf = key => {
    const box = boxes.get(key);
    return box ? box.y + box.height / 2 : null;
  };
  for (let d = 2; d <= maxDepth; d++) {
    const column = schematic.tanks.filter(t => !t.plantId && depth.get(t.tankId) === d).map(tank => {
      const centres = schematic.pipelines.filter(p => p.toId === tank.tankId).map(p => centreOf(`tank:${p.fromTankId}`)).filter(c => c !== null);
      const wanted = centres.length ? centres.reduce((a, b) => a + b, 0) / centres.length - size.tankHeight / 2 : size.margin;
      return { tank, wanted };
    });
    stack(column, () => size.tankHeight, size.rowGap + 14);
    for (const item of column) {
      boxes.set(`tank:${item.tank.tankId}`, { x: columnX[d], y: item.y, width: size.tankWidth, height: size.tankHeight });
    }
  }

  const bottom = Math.max(size.margin, ...[...boxes.values()].map(b => b.y + b.height));
  return { boxes, width: customerX + size.customerWidth + size.margin, height: bottom + size.margin };
}

/** The y of a stage's row inside its plant's box. */
export function stageRowY(plantBox, index) {
  return plantBox.y + size.plantHeader + index * size.stageRow;
}
