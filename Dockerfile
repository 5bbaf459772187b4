# The image docker-compose.yml builds: Node 20 on Debian bookworm, the app's npm dependencies, the built client,
# and Debian's PostgreSQL client (pg_dump and pg_restore, major 15) for `npm run backup` and `npm run restore`.
FROM node:20-bookworm-slim
RUN apt-get update \
  && apt-get install -y --no-install-recommends postgresql-client tar \
  && rm -rf /var/lib/apt/lists/*
WORKDIR /app
COPY package.json package-lock.json ./
RUN npm ci --no-audit --no-fund
COPY . .
RUN npm run build
ENV PORT=3000 HOST=0.0.0.0 DATA_DIR=/app/data
EXPOSE 3000
CMD ["npm", "start"]
