FROM node:20-bookworm-slim AS build
RUN apt-get update && apt-get install -y --no-install-recommends python3 make g++ && rm -rf /var/lib/apt/lists/*
WORKDIR /app
COPY . .
RUN npm ci --no-audit --no-fund && npm run build && npm prune --omit=dev

FROM node:20-bookworm-slim
# pg_dump and pg_restore (15, as the database image) for `npm run backup` / `npm run restore` inside the container.
RUN apt-get update && apt-get install -y --no-install-recommends postgresql-client && rm -rf /var/lib/apt/lists/*
WORKDIR /app
COPY --from=build --chown=node:node /app /app
RUN mkdir -p /var/lib/meritline && chown node:node /var/lib/meritline
ENV NODE_ENV=production DATA_DIR=/var/lib/meritline
USER node
EXPOSE 3000
CMD ["node", "backend/dist/main.js"]
